import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/auth/page-guard';
import { canWriteNotes, listNotes } from '@/lib/data/notes';
import { NotesList } from './_components/notes-list';

export const metadata: Metadata = { title: 'Meeting notes' };

export default async function NotesPage() {
  const viewer = await requirePageUser('/notes');
  const items = await listNotes(viewer);
  const writer = canWriteNotes(viewer);
  return (
    <div className="space-y-6">
      <div className="flex flex-wrap items-center justify-between gap-3">
        <h1 className="page-title">Meeting notes</h1>
        {writer ? (
          <Link href="/notes/new" className="btn-primary">
            Write a note
          </Link>
        ) : null}
      </div>
      <p className="max-w-2xl text-stone-700">
        The club’s record of each meeting, with links to the answers and species discussed.
        {writer ? ' Drafts are visible to librarians and administrators only.' : ''}
      </p>
      <NotesList initial={items} />
    </div>
  );
}
