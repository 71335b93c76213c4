import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/auth/page-guard';
import { listOwnAnswers } from '@/lib/data/answers';
import { listWizardSpeciesNames } from '@/lib/data/species';
import { AppError } from '@/lib/errors';
import { listAnswersQuerySchema } from '@/lib/validation/wizard';
import { actions } from '@/lib/wizard/types';
import { headlines } from '@/lib/wizard/engine';
import { WaitingAnswers } from '@/components/offline/waiting-answers';

export const metadata: Metadata = { title: 'Your answers' };

type Search = Record<string, string | string[] | undefined>;

export default async function AnswersPage({ searchParams }: { searchParams: Promise<Search> }) {
  const user = await requirePageUser('/answers');
  const raw = Object.fromEntries(
    Object.entries(await searchParams)
      .map(([k, v]) => [k, Array.isArray(v) ? v[0] : v])
      .filter(([, v]) => v),
  );
  const parsed = listAnswersQuerySchema.safeParse(raw);
  const q = parsed.success ? parsed.data : {};
  const [species, page] = await Promise.all([
    listWizardSpeciesNames(),
    listOwnAnswers(user, q).catch((e) => {
      if (e instanceof AppError) return { items: [], nextCursor: null, badCursor: true };
      throw e;
    }),
  ]);
  const next = new URLSearchParams({
    ...(q.species ? { species: q.species } : {}),
    ...(q.action ? { action: q.action } : {}),
    ...(page.nextCursor ? { cursor: page.nextCursor } : {}),
  });
  return (
    <div className="mx-auto max-w-3xl space-y-5">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="page-title">Your answers</h1>
        <Link href="/ask?start=new" className="btn-primary">
          Ask about a shoot
        </Link>
      </div>
      <WaitingAnswers />
      <form method="get" className="card grid gap-3 sm:grid-cols-[1fr_1fr_auto] sm:items-end" aria-label="Filter answers">
        <div>
          <label htmlFor="f-species" className="field-label">
            Species
          </label>
          <select id="f-species" name="species" defaultValue={q.species ?? ''} className="field-input">
            <option value="">All species</option>
            {species.map((s) => (
              <option key={s.slug} value={s.slug}>
                {s.commonNames[0]} ({s.botanicalName})
              </option>
            ))}
          </select>
        </div>
        <div>
          <label htmlFor="f-action" className="field-label">
            Action
          </label>
          <select id="f-action" name="action" defaultValue={q.action ?? ''} className="field-input">
            <option value="">All actions</option>
            {actions.map((a) => (
              <option key={a} value={a}>
                {headlines[a]}
              </option>
            ))}
          </select>
        </div>
        <button type="submit" className="btn-secondary">
          Filter
        </button>
      </form>
      {'badCursor' in page && (
        <p role="alert" className="rounded-lg bg-clay-100 p-3 text-clay-700">
          That page link is not valid. <Link href="/answers">Start from the newest.</Link>
        </p>
      )}
      {page.items.length === 0 ? (
        <p className="card text-stone-700" data-testid="answers-empty">
          {q.species || q.action ? 'No answers match these filters.' : 'No saved answers yet. Ask about a shoot and save the answer to find it here.'}
        </p>
      ) : (
        <ul className="space-y-3" data-testid="answers-list">
          {page.items.map((a) => (
            <li key={a.id}>
              <Link href={a.url} className="card block text-stone-900 no-underline hover:border-moss-400">
                <span className="block text-lg font-semibold text-moss-800">{a.headline}</span>
                <span className="block text-stone-700">
                  {a.speciesName} · {a.stage} · {a.season} · observed {a.observedOn}
                </span>
                <span className="mt-1 block text-sm text-stone-700">
                  {a.visibility === 'club' ? 'Shared with the club' : 'Only you'}
                  {a.note && <> · {a.note}</>}
                  {a.followUp && <> · follow-up recorded</>}
                </span>
              </Link>
            </li>
          ))}
        </ul>
      )}
      <div className="flex gap-3">
        {q.cursor && (
          <Link
            href={`/answers?${new URLSearchParams({ ...(q.species ? { species: q.species } : {}), ...(q.action ? { action: q.action } : {}) })}`}
            className="btn-secondary"
          >
            Newest
          </Link>
        )}
        {page.nextCursor && (
          <Link href={`/answers?${next}`} className="btn-secondary" data-testid="answers-older">
            Older answers
          </Link>
        )}
      </div>
    </div>
  );
}
