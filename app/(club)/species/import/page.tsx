import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageRole } from '@/lib/auth/page-guard';
import { ImportPanel } from './_components/import-panel';

export const metadata: Metadata = { title: 'Import species' };

export default async function ImportSpeciesPage() {
  await requirePageRole('editor', '/species/import');
  return (
    <div className="space-y-6">
      <p className="text-sm">
        <Link href="/species">Back to the species</Link>
      </p>
      <h1 className="page-title">Import species files</h1>
      <p className="max-w-prose text-stone-700">
        Upload one or more species <code>.md</code> files. Each is checked and shown with its errors per field before anything is written.
      </p>
      <ImportPanel />
    </div>
  );
}
