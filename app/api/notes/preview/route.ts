import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { requireRole } from '@/lib/auth/session';
import { renderNoteBody } from '@/lib/data/note-render';
import { notePreviewSchema } from '@/lib/validation/notes';

// The editor's live preview: the same sanitized pipeline and link cards as the published page.
export const POST = route(async (req) => {
  await requireRole('librarian', 'notes');
  const { body } = await parseJson(req, notePreviewSchema, { maxBytes: 400_000 });
  return NextResponse.json({ html: await renderNoteBody(body) });
});
