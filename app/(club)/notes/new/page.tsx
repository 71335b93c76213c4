import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageRole } from '@/lib/auth/page-guard';
import { NoteEditor } from '../_components/note-editor';

export const metadata: Metadata = { title: 'Write a meeting note' };

export default async function NewNotePage() {
  await requirePageRole('librarian', '/notes/new');
  return (
    <div className="space-y-6">
      <p className="no-print">
        <Link href="/notes">← Meeting notes</Link>
      </p>
      <h1 className="page-title">Write a meeting note</h1>
      <NoteEditor />
    </div>
  );
}
