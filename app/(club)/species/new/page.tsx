import type { Metadata } from 'next';
import { requirePageRole } from '@/lib/auth/page-guard';
import { blankSpecies } from '@/lib/species/template';
import { SpeciesForm } from '../_components/species-form';

export const metadata: Metadata = { title: 'Add a species' };

export default async function NewSpeciesPage() {
  await requirePageRole('editor', '/species/new');
  return (
    <div className="space-y-6">
      <h1 className="page-title">Add a species</h1>
      <p className="max-w-prose text-stone-700">Every value starts as “from memory”. Change the source of each one as you check it.</p>
      <SpeciesForm mode="create" initial={blankSpecies()} body="" />
    </div>
  );
}
