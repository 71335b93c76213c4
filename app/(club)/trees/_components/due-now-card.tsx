import Link from 'next/link';
import type { TreeDueNow } from '@/lib/data/tree-due-now';

const seasonWords: Record<string, string> = { winter: 'Winter', spring: 'Spring', summer: 'Summer', autumn: 'Autumn' };

// What to look for this month. Nobody has observed the shoots, so nothing here is an action:
// each line says what the wizard would answer if you see that state, and links to ask.
export function DueNowCard({ due, askHref }: { due: TreeDueNow; askHref: string }) {
  return (
    <section aria-labelledby="due-now" className="card space-y-3 border-moss-300 bg-moss-50" data-testid="due-now">
      <h2 id="due-now" className="text-xl">What to look for this month</h2>
      <p className="text-sm text-stone-700">
        {`${seasonWords[due.season]} in the ${due.hemisphere}ern hemisphere, ${due.stage} stage (${due.stageBasis}).`}
      </p>
      <p className="text-lg font-semibold text-moss-900" data-testid="due-now-headline">{due.headline}</p>
      <ul className="space-y-2">
        {due.lookFor.map((l) => (
          <li key={l.shoot}>
            <strong>If you see {l.label}:</strong> the wizard would likely say “{l.ifSeen}”.
          </li>
        ))}
      </ul>
      <p>Feeding: {due.feedingWindow}</p>
      <p className="text-sm text-stone-700">
        Look at a real shoot first, then <Link href={askHref}>ask about it</Link> for an answer you can act on.
      </p>
    </section>
  );
}
