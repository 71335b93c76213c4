import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { z } from 'zod';
import { getCurrentUser } from '@/lib/auth/session';
import { hasRole } from '@/lib/auth/roles';
import { isAppError } from '@/lib/errors';
import { getSpeciesForViewer, type SpeciesDetailDto } from '@/lib/data/species';
import { renderMarkdown } from '@/lib/markdown/render';
import { formatTraitValue, groupLabels, provenanceLabels, traitLabels, traitOrder } from '@/lib/species/labels';
import { wizardSummary } from '@/lib/species/wizard-summary';
import { slugSchema } from '@/lib/validation/species';
import { SourceMarker } from './_components/source-marker';
import { Backlinks } from '@/components/backlinks';
import { FocusNotice } from '@/components/focus-notice';
import { PublishDraft } from './_components/publish-draft';

type Props = { params: Promise<{ slug: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

async function load(slug: string, revisionParam: unknown): Promise<{ s: SpeciesDetailDto; editor: boolean } | null> {
  if (!slugSchema.safeParse(slug).success) return null;
  const viewer = await getCurrentUser();
  const editor = !!viewer && hasRole(viewer.role, 'editor');
  const rev = z.coerce.number().int().min(1).safeParse(revisionParam);
  try {
    // Only editors can open a given revision here; others always see the published one.
    return { s: await getSpeciesForViewer(viewer, slug, editor && rev.success ? rev.data : undefined), editor };
  } catch (e) {
    if (isAppError(e) && e.status === 404) return null;
    throw e;
  }
}

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug } = await params;
  return { title: slug.replace(/-/g, ' ').replace(/^./, (c) => c.toUpperCase()) };
}

export default async function SpeciesDetailPage({ params, searchParams }: Props) {
  const { slug } = await params;
  const sp = await searchParams;
  const loaded = await load(slug, Array.isArray(sp.revision) ? sp.revision[0] : sp.revision);
  if (!loaded) notFound();
  const { s, editor } = loaded;
  const rec = s.record;
  const html = await renderMarkdown(s.body);

  // Number each distinct work once, in trait order, for the sources list. A citation reads
  // "Work: detail"; the marker shows it whole, the list names the work.
  const citations: string[] = [];
  const numberOf = (c?: string) => {
    if (!c) return undefined;
    const work = c.split(': ')[0].trim();
    let i = citations.indexOf(work);
    if (i < 0) i = citations.push(work) - 1;
    return i + 1;
  };
  const rows = traitOrder.map((key) => {
    const t = rec.traits[key];
    return { key, t, n: t.provenance === 'published' ? numberOf(t.citation) : undefined };
  });
  const cautionNumbers = rec.cautions.map((c) => (c.provenance === 'published' ? numberOf(c.citation) : undefined));
  const isPublishedView = s.revision === s.publishedRevision;
  // After a save or a publish the editor lands here; the notice takes the focus and says what happened.
  const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
  const notice = !editor
    ? null
    : one(sp.published) && isPublishedView
      ? `Published: revision ${s.revision} is now what members and the wizard use.`
      : one(sp.saved) && s.status === 'draft'
        ? `Saved as draft revision ${s.revision}. Members still see the published revision.`
        : null;

  return (
    <article className="space-y-8">
      <header className="space-y-2">
        <p className="text-sm text-stone-700">
          <Link href="/species">Species</Link> <span aria-hidden>›</span> {groupLabels[rec.group]}
        </p>
        <h1 className="page-title italic">{rec.botanicalName}</h1>
        <p className="text-lg text-stone-800">{rec.commonNames.join(' · ')}</p>
        {rec.synonyms.length > 0 && <p className="text-sm text-stone-700">Also searched as: {rec.synonyms.join(', ')}</p>}
        {!isPublishedView && (
          <p className="rounded-lg border border-sun-500 bg-sun-100 p-3 text-sun-700" role="note" data-testid="revision-banner">
            You are looking at revision {s.revision} ({s.status === 'draft' ? 'a draft, not visible to members' : 'an earlier published revision'}).{' '}
            {s.publishedRevision ? <Link href={`/species/${s.slug}`}>See the published revision</Link> : 'This species has never been published.'}
          </p>
        )}
        {editor && s.status === 'draft' && s.revision === s.latestRevision && <PublishDraft slug={s.slug} revision={s.revision} />}
        {notice && <FocusNotice>{notice}</FocusNotice>}
        {editor && isPublishedView && s.latestRevision > (s.publishedRevision ?? 0) && (
          <p className="rounded-lg border border-sun-500 bg-sun-100 p-3 text-sun-700" role="note">
            A draft (revision {s.latestRevision}) is waiting. <Link href={`/species/${s.slug}?revision=${s.latestRevision}`}>Review the draft</Link>
          </p>
        )}
        <div className="flex flex-wrap gap-2 pt-2">
          {editor && (
            <Link href={`/species/${s.slug}/edit`} className="btn-primary" data-testid="edit-species">
              Edit
            </Link>
          )}
          <Link href={`/species/${s.slug}/history`} className="btn-secondary">
            Revision history
          </Link>
          <a href={`/api/species/${s.slug}/export${isPublishedView ? '' : `?revision=${s.revision}`}`} className="btn-secondary" download>
            Download .md
          </a>
        </div>
      </header>

      <section aria-labelledby="traits-h" className="card">
        <h2 id="traits-h" className="text-xl">
          Traits
        </h2>
        <p className="mt-1 text-sm text-stone-700">
          Each value carries its source: <strong>P</strong> {provenanceLabels.published.long.toLowerCase()}, <strong>C</strong> common practice,{' '}
          <strong>M</strong> from memory. Hover or focus a marker for the detail.
        </p>
        <dl className="mt-4 divide-y divide-stone-200" data-testid="traits">
          {rows.map(({ key, t, n }) => (
            <div key={key} className="grid gap-1 py-3 sm:grid-cols-3 sm:gap-4" data-testid={`trait-${key}`}>
              <dt className="font-medium text-stone-800">{traitLabels[key]}</dt>
              <dd className="flex flex-wrap items-center gap-2 sm:col-span-2">
                <span>{formatTraitValue(key, t.value)}</span>
                <SourceMarker id={`src-${key}`} provenance={t.provenance} citation={t.citation} note={t.note} sourceNumber={n} />
              </dd>
            </div>
          ))}
        </dl>
      </section>

      <section aria-labelledby="wizard-h" className="card bg-moss-50">
        <h2 id="wizard-h" className="text-xl">
          What the wizard does for this species
        </h2>
        <ul className="mt-3 list-disc space-y-2 pl-5" data-testid="wizard-summary">
          {wizardSummary(rec).map((line) => (
            <li key={line}>{line}</li>
          ))}
        </ul>
      </section>

      {rec.cautions.length > 0 && (
        <section aria-labelledby="cautions-h" className="rounded-card border border-clay-500 bg-clay-100 p-4 sm:p-6">
          <h2 id="cautions-h" className="text-xl text-clay-700">
            Cautions
          </h2>
          <ul className="mt-3 space-y-3">
            {rec.cautions.map((c, i) => (
              <li key={i} className="flex flex-wrap items-start gap-2">
                <span className="flex-1">{c.text}</span>
                <SourceMarker id={`caution-${i}`} provenance={c.provenance} citation={c.citation} sourceNumber={cautionNumbers[i]} align="end" />
              </li>
            ))}
          </ul>
          <p className="mt-3 text-sm text-stone-800">Local rules come first: check them before planting out, collecting or using chemicals.</p>
        </section>
      )}

      <section aria-labelledby="notes-h">
        <h2 id="notes-h" className="text-xl">
          Care notes
        </h2>
        {s.body.trim() ? (
          <div
            className="prose prose-stone mt-3 max-w-none prose-headings:font-display prose-h2:mt-4 prose-h2:text-lg prose-h3:text-base"
            dangerouslySetInnerHTML={{ __html: html }}
          />
        ) : (
          <p className="mt-3 text-stone-700">No care notes yet.</p>
        )}
      </section>

      <Backlinks type="species" id={s.slug} />

      <section aria-labelledby="sources-h" className="card">
        <h2 id="sources-h" className="text-xl">
          Sources
        </h2>
        {citations.length ? (
          <ol className="mt-3 list-decimal space-y-1 pl-6" data-testid="sources">
            {citations.map((c) => (
              <li key={c}>{c}</li>
            ))}
          </ol>
        ) : (
          <p className="mt-3 text-stone-700">No published sources yet: every value here is common practice or from memory.</p>
        )}
        <p className="mt-3 text-sm text-stone-700">
          Revision {s.revision}
          {s.editorName ? `, saved by ${s.editorName}` : ''} on <time dateTime={s.savedAt}>{s.savedAt.slice(0, 10)}</time>
          {s.summary ? ` (“${s.summary}”)` : ''}.
        </p>
      </section>
    </article>
  );
}
