import Link from 'next/link';
import type { TreeDueNow } from '@/lib/data/tree-due-now';

const seasonWords: Record<string, string> = { winter: 'Winter', spring: 'Spring', summer: 'Summer', autumn: 'Autumn' };
const shootWords: Record<string, string> = {
  'dormant-bud': 'buds still dormant',
  'candle-extending': 'candles extending',
  'needles-opening': 'needles opening on the candles',
  'needles-hardened': 'this year’s needles hardened',
};

export function DueNowCard({ due, askHref }: { due: TreeDueNow; askHref: string }) {
  return (
    <section aria-labelledby="due-now" className="card space-y-3 border-moss-300 bg-moss-50" data-testid="due-now">
      <h2 id="due-now" className="text-xl">Due now</h2>
      <p className="text-sm text-stone-700">
        {`${seasonWords[due.season]} in the ${due.hemisphere}ern hemisphere, ${due.stage} stage (${due.stageBasis}). The usual state of a shoot now: ${shootWords[due.assumedShoot] ?? due.assumedShoot}.`}
      </p>
      <p className="text-lg font-semibold text-moss-900" data-testid="due-now-headline">{due.headline}</p>
      <p>{due.feedNow ? `Feeding: yes — ${due.feedingWindow}` : `Feeding: not now — ${due.feedingWindow}`}</p>
      {due.watch.length ? (
        <div>
          <h3 className="text-base font-semibold">Watch for</h3>
          <ul className="list-disc space-y-1 pl-5">
            {due.watch.map((w) => <li key={w}>{w}</li>)}
          </ul>
        </div>
      ) : null}
      <p className="text-sm text-stone-700">
        This is what the season suggests for a typical outer shoot at this stage. Your shoots may differ: <Link href={askHref}>ask about a real shoot</Link> for an answer.
      </p>
    </section>
  );
}
