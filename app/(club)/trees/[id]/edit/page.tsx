import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/auth/page-guard';
import { listSpeciesOptions } from '@/lib/data/trees';
import { TreeForm } from '../../_components/tree-form';
import { loadTreeOr404 } from '../../_components/load-tree';

export const metadata: Metadata = { title: 'Edit tree' };

export default async function EditTreePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageUser(`/trees/${encodeURIComponent(id)}/edit`);
  const tree = await loadTreeOr404(actor, id);
  const species = await listSpeciesOptions();
  const { id: _id, speciesName: _n, createdAt: _c, updatedAt: _u, ...initial } = tree;
  return (
    <div className="space-y-6">
      <p>
        <Link href={`/trees/${tree.id}`}>← {tree.name}</Link>
      </p>
      <h1 className="page-title">Edit {tree.name}</h1>
      <TreeForm species={species} initial={initial} treeId={tree.id} />
    </div>
  );
}
