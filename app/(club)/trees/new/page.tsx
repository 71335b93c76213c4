import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/auth/page-guard';
import { listSpeciesOptions } from '@/lib/data/trees';
import { TreeForm } from '../_components/tree-form';

export const metadata: Metadata = { title: 'Add a tree' };

export default async function NewTreePage() {
  await requirePageUser('/trees/new');
  const species = await listSpeciesOptions();
  return (
    <div className="space-y-6">
      <p>
        <Link href="/trees">← Your trees</Link>
      </p>
      <h1 className="page-title">Add a tree</h1>
      <TreeForm species={species} />
    </div>
  );
}
