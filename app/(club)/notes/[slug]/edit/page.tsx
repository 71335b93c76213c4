import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageRole } from '@/lib/auth/page-guard';
import { NoteEditor } from '../../_components/note-editor';
import { loadNoteOr404 } from '../../_components/load-note';

export const metadata: Metadata = { title: 'Edit meeting note' };

export default async function EditNotePage({ params }: { params: Promise<{ slug: string }> }) {
  const { slug } = await params;
  const actor = await requirePageRole('librarian', `/notes/${encodeURIComponent(slug)}/edit`);
  const note = await loadNoteOr404(actor, slug);
  return (
    <div className="space-y-6">
      <p>
        <Link href={`/notes/${note.slug}`}>← {note.title}</Link>
      </p>
      <h1 className="page-title">Edit: {note.title}</h1>
      <NoteEditor note={note} />
    </div>
  );
}
