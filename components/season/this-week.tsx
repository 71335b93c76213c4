import Link from 'next/link';
import type { WeekItem } from '@/lib/data/plan';
import { ObservationButton } from './plan-actions';

/** Every tree's tasks open now or due within 14 days, on the member's home. */
export function ThisWeek({ items, today }: { items: WeekItem[]; today: string }) {
  return (
    <section aria-labelledby="this-week" className="card space-y-3" data-testid="this-week">
      <h2 id="this-week" className="text-xl">
        This week
      </h2>
      {items.length === 0 ? (
        <p className="text-stone-700" data-testid="this-week-empty">
          Nothing due on your trees in the next 14 days.
        </p>
      ) : (
        <ul className="space-y-3">
          {items.map((it) => (
            <li
              key={`${it.treeId}-${it.window.task}-${it.window.from}`}
              className="space-y-2 border-b border-stone-200 pb-3 last:border-0"
              data-testid="week-item"
              data-task={it.window.task}
            >
              <p>
                <Link href={`/trees/${it.treeId}`} className="font-semibold">
                  {it.treeName}
                </Link>
                {`: ${it.window.label}`}
                <span className="block text-sm text-stone-700">
                  {it.window.from <= today ? `Open now, until ${it.window.to}` : `From ${it.window.from} to ${it.window.to}`}
                </span>
              </p>
              <div className="flex flex-wrap gap-3">
                <Link href={`/ask?tree=${encodeURIComponent(it.treeId)}&species=${encodeURIComponent(it.speciesSlug)}`} className="btn-primary">
                  Ask about this tree
                </Link>
                <ObservationButton treeId={it.treeId} body={{ task: it.window.task }} label="Done" testId="week-done" />
              </div>
            </li>
          ))}
        </ul>
      )}
    </section>
  );
}
