import type { Metadata } from 'next';
import Link from 'next/link';
import { getCurrentUser } from '@/lib/auth/session';
import { hasRole } from '@/lib/auth/roles';
import { listAllSpecies } from '@/lib/data/species-list';
import { SpeciesTable, type SpeciesFilters } from '../_components/species-table';

export const metadata: Metadata = { title: 'Species' };

const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) ?? '';

export default async function SpeciesPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const sp = await searchParams;
  const viewer = await getCurrentUser();
  const editor = !!viewer && hasRole(viewer.role, 'editor');
  const items = await listAllSpecies(viewer);
  const initial: SpeciesFilters = {
    q: one(sp.q).slice(0, 100),
    group: one(sp.group),
    flush: one(sp.flush),
    vigour: one(sp.vigour),
    needleMin: one(sp.needleMin),
    needleMax: one(sp.needleMax),
  };
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-end justify-between gap-3">
        <div>
          <h1 className="page-title">Species</h1>
          <p className="mt-1 max-w-prose text-stone-700">
            The traits behind every answer, each with where it comes from. Search by botanical name, common name or an older spelling.
          </p>
        </div>
        <div className="flex flex-wrap gap-2">
          {editor && (
            <>
              <Link href="/species/new" className="btn-primary">
                Add a species
              </Link>
              <Link href="/species/import" className="btn-secondary">
                Import .md files
              </Link>
            </>
          )}
          <a href="/api/species/export" className="btn-secondary" download>
            Download all (.zip)
          </a>
        </div>
      </div>
      <SpeciesTable items={items} initial={initial} showDrafts={editor} />
    </div>
  );
}
