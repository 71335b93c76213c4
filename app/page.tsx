import Link from 'next/link';
import { getClubSettings } from '@/lib/data/settings';
import { getCurrentUser } from '@/lib/auth/session';
import { thisWeek } from '@/lib/data/plan';
import { ThisWeek } from '@/components/season/this-week';
import { todayIso } from '@/lib/validation/trees';

export default async function HomePage() {
  const [settings, user] = await Promise.all([getClubSettings(), getCurrentUser()]);
  const today = todayIso();
  const week = user ? await thisWeek(user, today) : null;
  return (
    <div className="space-y-10">
      <section className="space-y-4">
        <p className="text-sm font-medium uppercase tracking-wide text-bark-700">{settings.clubName}</p>
        <h1 className="text-3xl sm:text-4xl">Know what to do with this shoot, today.</h1>
        <p className="max-w-2xl text-lg text-stone-700">
          Candlewise tells you whether to pinch, prune, let grow or decandle a pine shoot, from the species, the stage of the tree, the shoot itself and the
          season, with the reasons and a feeding plan. Every answer is kept in your record, so the club can look back at what was done and what happened.
        </p>
      </section>
      {week ? <ThisWeek items={week} today={today} /> : null}
      <section aria-label="Start here" className="grid gap-4 sm:grid-cols-2">
        <Link href="/ask?start=new" className="card block no-underline hover:border-moss-400" data-testid="door-ask">
          <h2 className="text-xl">Ask about a shoot</h2>
          <p className="mt-2 text-stone-700">Answer a few questions standing at the tree and get one clear action.</p>
          <span className="btn-primary mt-4">Start</span>
        </Link>
        <Link href="/species" className="card block no-underline hover:border-moss-400" data-testid="door-species">
          <h2 className="text-xl">Look up a species</h2>
          <p className="mt-2 text-stone-700">Flush habit, needle length, vigour and care notes, each with its source.</p>
          <span className="btn-secondary mt-4">Browse species</span>
        </Link>
      </section>
    </div>
  );
}
