import type { TreePlanDto } from '@/lib/data/plan';
import { daysBetween } from '@/lib/season/degree-days';
import { ObservationButton } from '@/components/season/plan-actions';

const basisWords: Record<string, string> = {
  'degree-days': 'timed by the temperature record’s heat sum',
  latitude: 'timed by a climate estimate for the club’s latitude (no temperature record yet)',
  observed: 'timed by what you saw on this tree',
};

const seenOptions = [
  { shoot: 'candle-extending', label: 'Candles extending today' },
  { shoot: 'needles-opening', label: 'Needles opening today' },
];

/** The tree's season as a list of windows with a bar across the season year (CSS, not a chart). */
export function SeasonTimeline({ plan, stage, stageBasis }: { plan: TreePlanDto; stage: string; stageBasis?: string }) {
  const span = 365;
  return (
    <section aria-labelledby="season" className="card space-y-4 border-moss-300 bg-moss-50" data-testid="season-timeline">
      <h2 id="season" className="text-xl">
        This season
      </h2>
      <p className="text-sm text-stone-700">
        {`${stage[0].toUpperCase()}${stage.slice(1)} stage${stageBasis ? ` (${stageBasis})` : ''}; ${basisWords[plan.basis]}.`}
        {plan.degreeDaysToDate !== null ? ` Heat sum so far: ${plan.degreeDaysToDate} °C days above +5 °C.` : ''}
      </p>
      {plan.notes.map((n) => (
        <p key={n} className="text-sm text-stone-700">
          {n}
        </p>
      ))}
      {plan.windows.length === 0 ? (
        <p>No windows this season: ask the wizard about each shoot as you see it.</p>
      ) : (
        <ol className="space-y-3">
          {plan.windows.map((w) => {
            const left = Math.max(0, daysBetween(plan.seasonStart, w.from)) / span;
            const width = Math.max(1, daysBetween(w.from, w.to) + 1) / span;
            const now = w.from <= plan.today && plan.today <= w.to;
            return (
              <li key={`${w.task}-${w.from}`} className="space-y-1" data-testid="season-window" data-task={w.task}>
                <div className="flex flex-wrap items-baseline justify-between gap-2">
                  <span className="font-semibold">
                    {w.label}
                    {now ? ' — now' : ''}
                    {w.doneOn ? ` (done ${w.doneOn})` : ''}
                  </span>
                  <span className="text-sm text-stone-700">
                    <time dateTime={w.from}>{w.from}</time> to <time dateTime={w.to}>{w.to}</time>
                  </span>
                </div>
                <div className="relative h-2 w-full rounded bg-stone-200" aria-hidden="true">
                  <div
                    className={`absolute h-2 rounded ${w.doneOn ? 'bg-stone-500' : 'bg-moss-700'}`}
                    style={{ left: `${left * 100}%`, width: `${Math.min(width, 1 - left) * 100}%` }}
                  />
                </div>
                <details className="text-sm text-stone-700">
                  <summary>Why then</summary>
                  <ul className="list-disc pl-5">
                    {w.reasons.map((r) => (
                      <li key={r}>{r}</li>
                    ))}
                  </ul>
                </details>
              </li>
            );
          })}
        </ol>
      )}
      <div className="flex flex-wrap gap-3">
        {seenOptions.map((o) => (
          <ObservationButton key={o.shoot} treeId={plan.treeId} body={{ shoot: o.shoot }} label={o.label} testId={`seen-${o.shoot}`} />
        ))}
        <a href={`/api/trees/${plan.treeId}/plan.ics`} className="btn-secondary">
          Add to a calendar
        </a>
        <a href="/season" className="btn-secondary">
          Temperature record
        </a>
      </div>
    </section>
  );
}
