import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { diffLines } from 'diff';
import { requirePageUser } from '@/lib/auth/page-guard';
import { hasRole } from '@/lib/auth/roles';
import { isAppError } from '@/lib/errors';
import { getSpeciesForViewer, listSpeciesRevisions } from '@/lib/data/species';
import { serializeSpeciesMarkdown } from '@/lib/species/content';
import { slugSchema } from '@/lib/validation/species';
import { RevertButton } from './_components/revert-button';

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
  const known = new Set(revisions.map((r) => r.revision));
  const newest = revisions[0]?.revision;
  const to = known.has(int(sp.to) ?? -1) ? int(sp.to)! : newest;
  const fallbackFrom = revisions.find((r) => r.revision < (to ?? 0))?.revision;
  const from = known.has(int(sp.from) ?? -1) ? int(sp.from)! : fallbackFrom;

  let diff: { added?: boolean; removed?: boolean; value: string }[] | null = null;
  if (from && to && from !== to) {
    const [a, b] = await Promise.all([getSpeciesForViewer(viewer, slug, from), getSpeciesForViewer(viewer, slug, to)]);
    diff = diffLines(serializeSpeciesMarkdown(a.record, a.body), serializeSpeciesMarkdown(b.record, b.body));
  }
  const latest = revisions[0];

  return (
    <div className="space-y-6">
      <p className="text-sm"><Link href={`/species/${slug}`}>Back to the species</Link></p>
      <h1 className="page-title">Revision history</h1>
      {!editor && <p className="text-stone-700">Published revisions only; drafts are kept by the editors.</p>}

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
              <p className="text-sm text-stone-700">
                {r.editorName ?? 'Species library'}, <time dateTime={r.savedAt}>{r.savedAt.slice(0, 16).replace('T', ' ')} UTC</time>
              </p>
            </div>
            {editor && (
              <div className="flex flex-wrap gap-2">
                <Link className="btn-secondary" href={`/species/${slug}?revision=${r.revision}`} aria-label={`View revision ${r.revision}`}>View</Link>
                {latest && r.revision !== latest.revision && <RevertButton slug={slug} toRevision={r.revision} baseRevision={latest.revision} />}
              </div>
            )}
          </li>
        ))}
      </ol>

      <section aria-labelledby="diff-h" className="card space-y-4">
        <h2 id="diff-h" className="text-xl">Compare two revisions</h2>
        {revisions.length < 2 ? (
          <p className="text-stone-700">There is only one revision so far.</p>
        ) : (
          <form method="get" className="flex flex-wrap items-end gap-3">
            <div>
              <label htmlFor="diff-from" className="field-label">From</label>
              <select id="diff-from" name="from" defaultValue={from} className="field-input">
                {revisions.map((r) => <option key={r.revision} value={r.revision}>Revision {r.revision}</option>)}
              </select>
            </div>
            <div>
              <label htmlFor="diff-to" className="field-label">To</label>
              <select id="diff-to" name="to" defaultValue={to} className="field-input">
                {revisions.map((r) => <option key={r.revision} value={r.revision}>Revision {r.revision}</option>)}
              </select>
            </div>
            <button type="submit" className="btn-primary">Compare</button>
          </form>
        )}
        {diff && (
          <div>
            <p className="mb-2 text-sm text-stone-700">
              Revision {from} → {to}: <span className="bg-moss-100 px-1">added lines</span> and <span className="bg-clay-100 px-1 line-through">removed lines</span>.
            </p>
            <pre className="whitespace-pre-wrap break-words rounded-lg border border-stone-200 bg-stone-50 p-3 text-xs leading-relaxed" data-testid="diff">
              {diff.map((part, i) =>
                part.value.replace(/\n$/, '').split('\n').map((line, j, lines) => {
                  if (!part.added && !part.removed) {
                    // Long unchanged runs fold to their first and last lines.
                    const keep = 2;
                    if (lines.length > keep * 2 + 2 && j >= keep && j < lines.length - keep) {
                      return j === keep ? <span key={`${i}-${j}`} className="block italic text-stone-500">  … {lines.length - keep * 2} unchanged lines</span> : null;
                    }
                    return <span key={`${i}-${j}`} className="block text-stone-600">  {line}</span>;
                  }
                  return (
                    <span key={`${i}-${j}`} className={`block ${part.added ? 'bg-moss-100 text-moss-900' : 'bg-clay-100 text-clay-700'}`} data-testid={part.added ? 'diff-added' : 'diff-removed'}>
                      <span className="sr-only">{part.added ? 'Added: ' : 'Removed: '}</span>
                      <span aria-hidden>{part.added ? '+ ' : '- '}</span>
                      {line}
                    </span>
                  );
                }),
              )}
            </pre>
          </div>
        )}
        {from === to && revisions.length > 1 && <p className="text-stone-700">Choose two different revisions.</p>}
      </section>
    </div>
  );
}
