import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePageUser } from '@/lib/auth/page-guard';
import { hasRole } from '@/lib/auth/roles';
import { isAppError } from '@/lib/errors';
import { getSpeciesForViewer, listSpeciesRevisions } from '@/lib/data/species';
import { revisionDiff, sameContent, type BodyPart } from '@/lib/species/revision-diff';
import { slugSchema } from '@/lib/validation/species';
import { RevertButton } from './_components/revert-button';
import { FocusNotice } from '@/components/focus-notice';

export const metadata: Metadata = { title: 'Revision history' };

type Props = { params: Promise<{ slug: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };
const int = (v: string | string[] | undefined) => {
  const n = Number(Array.isArray(v) ? v[0] : v);
  return Number.isInteger(n) && n > 0 ? n : undefined;
};

export default async function HistoryPage({ params, searchParams }: Props) {
  const { slug } = await params;
  const viewer = await requirePageUser(`/species/${slug}/history`);
  if (!slugSchema.safeParse(slug).success) notFound();
  const editor = hasRole(viewer.role, 'editor');
  let revisions;
  try {
    revisions = await listSpeciesRevisions(viewer, slug);
  } catch (e) {
    if (isAppError(e) && e.status === 404) notFound();
    throw e;
  }
  const sp = await searchParams;
  // The content of each revision, to say which are identical to the one before (a revert of a
  // revert, a save without changes): those are never the default side of a comparison.
  const contents = new Map(
    await Promise.all(
      revisions.map(async (r) => {
        const s = await getSpeciesForViewer(viewer, slug, r.revision);
        return [r.revision, { record: s.record, body: s.body }] as const;
      }),
    ),
  );
  const sameAsPrevious = new Map<number, number>();
  revisions.forEach((r, i) => {
    const prev = revisions[i + 1];
    if (prev && sameContent(contents.get(r.revision)!, contents.get(prev.revision)!))
      sameAsPrevious.set(r.revision, sameAsPrevious.get(prev.revision) ?? prev.revision);
  });
  const known = new Set(revisions.map((r) => r.revision));
  const newest = revisions[0]?.revision;
  const to = known.has(int(sp.to) ?? -1) ? int(sp.to)! : newest;
  const fallbackFrom =
    revisions.find((r) => r.revision < (to ?? 0) && !sameContent(contents.get(r.revision)!, contents.get(to!)!))?.revision ??
    revisions.find((r) => r.revision < (to ?? 0))?.revision;
  const from = known.has(int(sp.from) ?? -1) ? int(sp.from)! : fallbackFrom;

  const diff = from && to && from !== to ? revisionDiff(contents.get(from)!, contents.get(to)!) : null;
  const latest = revisions[0];
  const reverted = int(sp.reverted);
  const optionLabel = (n: number) => (sameAsPrevious.has(n) ? `Revision ${n} (same as ${sameAsPrevious.get(n)})` : `Revision ${n}`);

  return (
    <div className="space-y-6">
      <p className="text-sm">
        <Link href={`/species/${slug}`}>Back to the species</Link>
      </p>
      <h1 className="page-title">Revision history</h1>
      {!editor && <p className="text-stone-700">Published revisions only; drafts are kept by the editors.</p>}
      {editor && reverted && latest && (
        <FocusNotice>
          Reverted: revision {latest.revision} is a published copy of revision {reverted}.
        </FocusNotice>
      )}

      <ol className="space-y-3" data-testid="revisions" aria-label="Revisions, newest first">
        {revisions.map((r) => (
          <li key={r.revision} className="card flex flex-wrap items-center justify-between gap-3 py-3 sm:py-4">
            <div className="min-w-0 space-y-1">
              <p>
                <span className="font-semibold">Revision {r.revision}</span>{' '}
                <span className={`rounded px-1.5 text-xs ${r.status === 'draft' ? 'bg-sun-100 text-sun-700' : 'bg-moss-50 text-moss-800'}`}>
                  {r.current ? 'live' : r.status === 'draft' ? 'draft' : 'published'}
                </span>
              </p>
              <p className="text-stone-900">{r.summary || 'No summary'}</p>
              {sameAsPrevious.has(r.revision) && <p className="text-sm text-stone-700">Same content as revision {sameAsPrevious.get(r.revision)}.</p>}
              <p className="text-sm text-stone-700">
                {r.editorName ?? 'Species library'}, <time dateTime={r.savedAt}>{r.savedAt.slice(0, 16).replace('T', ' ')} UTC</time>
              </p>
            </div>
            {editor && (
              <div className="flex flex-wrap gap-2">
                <Link className="btn-secondary" href={`/species/${slug}?revision=${r.revision}`} aria-label={`View revision ${r.revision}`}>
                  View
                </Link>
                {latest && r.revision !== latest.revision && <RevertButton slug={slug} toRevision={r.revision} baseRevision={latest.revision} />}
              </div>
            )}
          </li>
        ))}
      </ol>

      <section aria-labelledby="diff-h" className="card space-y-4">
        <h2 id="diff-h" className="text-xl">
          Compare two revisions
        </h2>
        {revisions.length < 2 ? (
          <p className="text-stone-700">There is only one revision so far.</p>
        ) : (
          <form method="get" className="flex flex-wrap items-end gap-3">
            <div>
              <label htmlFor="diff-from" className="field-label">
                From
              </label>
              <select id="diff-from" name="from" defaultValue={from} className="field-input">
                {revisions.map((r) => (
                  <option key={r.revision} value={r.revision}>
                    {optionLabel(r.revision)}
                  </option>
                ))}
              </select>
            </div>
            <div>
              <label htmlFor="diff-to" className="field-label">
                To
              </label>
              <select id="diff-to" name="to" defaultValue={to} className="field-input">
                {revisions.map((r) => (
                  <option key={r.revision} value={r.revision}>
                    {optionLabel(r.revision)}
                  </option>
                ))}
              </select>
            </div>
            <button type="submit" className="btn-primary">
              Compare
            </button>
          </form>
        )}
        {diff && (
          <div className="space-y-4" data-testid="diff" aria-live="polite">
            <p className="text-sm text-stone-700">
              Revision {from} → {to}
            </p>
            {diff.same ? (
              <p className="rounded-lg border border-stone-200 bg-stone-50 p-3" data-testid="no-differences">
                No differences: revisions {from} and {to} hold the same content.
              </p>
            ) : (
              <>
                <div>
                  <h3 className="text-base font-semibold">Traits and fields</h3>
                  {diff.changes.length ? (
                    <ul className="mt-1 list-disc space-y-1 pl-5 break-words" data-testid="trait-changes">
                      {diff.changes.map((c, i) => (
                        <li key={i}>{c.text}</li>
                      ))}
                    </ul>
                  ) : (
                    <p className="mt-1 text-stone-700">No trait or field changed.</p>
                  )}
                </div>
                <div>
                  <h3 className="text-base font-semibold">Care notes</h3>
                  {diff.bodyChanged ? (
                    <>
                      <p className="mb-2 text-sm text-stone-700">
                        The Markdown as written, with <ins className="bg-moss-100 text-moss-900 no-underline">added words</ins> and{' '}
                        <del className="bg-clay-100 text-clay-700">removed words</del> marked in place.
                      </p>
                      <div
                        className="whitespace-pre-wrap break-words rounded-lg border border-stone-200 bg-stone-50 p-3 font-mono text-xs leading-relaxed"
                        data-testid="body-diff"
                      >
                        {diff.body.map((part, i) => (
                          <DiffPart key={i} part={part} />
                        ))}
                      </div>
                    </>
                  ) : (
                    <p className="mt-1 text-stone-700">The care notes did not change.</p>
                  )}
                </div>
              </>
            )}
          </div>
        )}
        {from === to && revisions.length > 1 && <p className="text-stone-700">Choose two different revisions.</p>}
      </section>
    </div>
  );
}

/** Unchanged runs of many lines fold to their first and last two lines. */
function DiffPart({ part }: { part: BodyPart }) {
  if (part.kind === 'added') {
    return (
      <ins className="bg-moss-100 text-moss-900 no-underline" data-testid="diff-added">
        <span className="sr-only">[added: </span>
        {part.value}
        <span className="sr-only">]</span>
      </ins>
    );
  }
  if (part.kind === 'removed') {
    return (
      <del className="bg-clay-100 text-clay-700" data-testid="diff-removed">
        <span className="sr-only">[removed: </span>
        {part.value}
        <span className="sr-only">]</span>
      </del>
    );
  }
  const lines = part.value.split('\n');
  const keep = 2;
  if (lines.length <= keep * 2 + 2) return <span className="text-stone-700">{part.value}</span>;
  return (
    <span className="text-stone-700">
      {lines.slice(0, keep + 1).join('\n')}
      {'\n'}
      <span className="italic text-stone-600">… {lines.length - keep * 2 - 2} unchanged lines …</span>
      {'\n'}
      {lines.slice(-keep - 1).join('\n')}
    </span>
  );
}
