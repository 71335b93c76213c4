import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePageRole } from '@/lib/auth/page-guard';
import { isAppError } from '@/lib/errors';
import { getSpeciesForViewer } from '@/lib/data/species';
import { slugSchema } from '@/lib/validation/species';
import { SpeciesForm } from '../../_components/species-form';

export const metadata: Metadata = { title: 'Edit species' };

export default async function EditSpeciesPage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const editor = await requirePageRole('editor', `/species/${slug}/edit`);
  if (!slugSchema.safeParse(slug).success) notFound();
  let latest;
  try {
    const current = await getSpeciesForViewer(editor, slug);
    // Edit on top of the newest revision, draft or not, so no draft is silently overwritten.
    latest = current.revision === current.latestRevision ? current : await getSpeciesForViewer(editor, slug, current.latestRevision);
  } catch (e) {
    if (isAppError(e) && e.status === 404) notFound();
    throw e;
  }
  return (
    <div className="space-y-6">
      <p className="text-sm">
        <Link href={`/species/${slug}`}>Back to the species</Link>
      </p>
      <h1 className="page-title">
        Edit <span className="italic">{latest.record.botanicalName}</span>
      </h1>
      <p className="text-stone-700" data-testid="base-revision">
        Starting from revision {latest.revision} ({latest.status === 'draft' ? 'a draft' : 'published'}).
      </p>
      <SpeciesForm mode="edit" initial={latest.record} body={latest.body} baseRevision={latest.latestRevision} />
    </div>
  );
}
