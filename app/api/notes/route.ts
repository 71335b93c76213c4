import { NextResponse } from 'next/server';
import { parseJson, parseQuery, route } from '@/lib/http/route';
import { requireRole, requireUser } from '@/lib/auth/session';
import { createNote, listNotes } from '@/lib/data/notes';
import { noteInputSchema, noteListQuerySchema } from '@/lib/validation/notes';

// GET: signed-in members (published notes; librarians and admins also drafts). POST: librarian or admin.
export const GET = route(async (req) => {
  const viewer = await requireUser();
  const query = parseQuery(req, noteListQuerySchema);
  return NextResponse.json({ items: await listNotes(viewer, query) });
});

export const POST = route(async (req) => {
  const actor = await requireRole('librarian', 'notes');
  const input = await parseJson(req, noteInputSchema);
  const note = await createNote(actor, input);
  return NextResponse.json({ note }, { status: 201 });
});
