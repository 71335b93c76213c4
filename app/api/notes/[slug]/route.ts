import { NextResponse } from 'next/server';
import { z } from 'zod';
import { parseJson, parseQuery, route } from '@/lib/http/route';
import { requireRole, requireUser } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { deleteNote, getNote, updateNote } from '@/lib/data/notes';
import { renderNoteBody } from '@/lib/data/note-render';
import { noteAsMarkdown } from '@/lib/notes/export';
import { notePatchSchema, noteSlugSchema } from '@/lib/validation/notes';

type Params = { slug: string };

async function slugOf(params: Promise<Params>) {
  const { slug } = await params;
  if (!noteSlugSchema.safeParse(slug).success) throw new AppError('not_found:note', 'No such note.');
  return slug;
}

const getQuery = z.object({ format: z.enum(['json', 'md']).default('json') });

// GET: the note (JSON with its rendered HTML, or `?format=md` to download the Markdown).
export const GET = route<Params>(async (req, { params }) => {
  const viewer = await requireUser();
  const { format } = parseQuery(req, getQuery);
  const note = await getNote(viewer, await slugOf(params));
  if (format === 'md') {
    return new NextResponse(noteAsMarkdown(note), {
      headers: {
        'content-type': 'text/markdown; charset=utf-8',
        'content-disposition': `attachment; filename="${note.slug}.md"`,
        'x-content-type-options': 'nosniff',
      },
    });
  }
  return NextResponse.json({ note, html: await renderNoteBody(note.body) });
});

export const PATCH = route<Params>(async (req, { params }) => {
  const actor = await requireRole('librarian', 'notes');
  const patch = await parseJson(req, notePatchSchema);
  return NextResponse.json({ note: await updateNote(actor, await slugOf(params), patch) });
});

export const DELETE = route<Params>(async (_req, { params }) => {
  const actor = await requireRole('librarian', 'notes');
  await deleteNote(actor, await slugOf(params));
  return new NextResponse(null, { status: 204 });
});
