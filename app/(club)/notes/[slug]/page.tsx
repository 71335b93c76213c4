import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/auth/page-guard';
import { canWriteNotes } from '@/lib/data/notes';
import { FocusNotice } from '@/components/focus-notice';
import { renderNoteBody } from '@/lib/data/note-render';
import { formatMeetingDate } from '@/lib/validation/notes';
import { loadNoteOr404 } from '../_components/load-note';
import { StatusBadge } from '../_components/notes-list';
import { NoteActions } from '../_components/note-actions';

type Props = { params: Promise<{ slug: string }>; searchParams: Promise<Record<string, string | string[] | undefined>> };

export async function generateMetadata({ params }: Props): Promise<Metadata> {
  const { slug } = await params;
  return { title: `Meeting note ${slug.slice(0, 10)}` };
}

export default async function NotePage({ params, searchParams }: Props) {
  const { slug } = await params;
  const viewer = await requirePageUser(`/notes/${encodeURIComponent(slug)}`);
  const note = await loadNoteOr404(viewer, slug);
  const html = await renderNoteBody(note.body);
  const writer = canWriteNotes(viewer);
  // After a save the librarian lands here; the notice takes the focus and says what happened.
  const saved = (await searchParams).saved;
  const notice = !writer
    ? null
    : saved === 'published' && note.status === 'published'
      ? 'Saved and published: members can read this note.'
      : saved === 'draft' && note.status === 'draft'
        ? 'Saved as a draft: only librarians can see it.'
        : null;
  return (
    <div className="space-y-6">
      <p className="no-print">
        <Link href="/notes">← Meeting notes</Link>
      </p>
      {notice && (
        <div className="no-print">
          <FocusNotice>{notice}</FocusNotice>
        </div>
      )}
      <article className="card print-plain space-y-4" data-testid="note">
        <header className="space-y-1 border-b border-stone-200 pb-4">
          <p className="text-sm font-medium uppercase tracking-wide text-bark-700">
            Meeting of <time dateTime={note.meetingDate}>{formatMeetingDate(note.meetingDate)}</time>
          </p>
          <h1 className="page-title" data-testid="note-title">
            {note.title}
          </h1>
          <p className="text-stone-700">
            Written by {note.authorName}
            {note.status === 'draft' ? (
              <span className="ml-2">
                <StatusBadge status="draft" />
              </span>
            ) : null}
          </p>
        </header>
        {/* Sanitized by the shared Markdown pipeline; link cards show only what the club may see. */}
        <div className="prose prose-stone max-w-none" data-testid="note-body" dangerouslySetInnerHTML={{ __html: html }} />
      </article>
      <NoteActions slug={note.slug} title={note.title} status={note.status} writer={writer} />
    </div>
  );
}
