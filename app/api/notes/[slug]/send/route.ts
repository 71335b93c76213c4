import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { requireRole } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { digestStatus, previewNoteDigest, sendNoteDigest } from '@/lib/data/digests';
import { noteSlugSchema, sendDigestSchema } from '@/lib/validation/notes';

type Params = { slug: string };

async function slugOf(params: Promise<Params>) {
  const { slug } = await params;
  if (!noteSlugSchema.safeParse(slug).success) throw new AppError('not_found:note', 'No such note.');
  return slug;
}

// GET: earlier sends and how many members opted in; with `?preview=1`, the digest as a member
// will get it (subject, HTML and text) and the number of recipients. POST: send the published note by e-mail;
// a repeat needs `{ "confirm": true }`, else 409 with the previous send. Librarian or admin.
export const GET = route<Params>(async (req, { params }) => {
  const actor = await requireRole('librarian', 'notes');
  const slug = await slugOf(params);
  if (new URL(req.url).searchParams.get('preview') === '1') return NextResponse.json(await previewNoteDigest(actor, slug));
  return NextResponse.json(await digestStatus(actor, slug));
});

export const POST = route<Params>(async (req, { params }) => {
  const actor = await requireRole('librarian', 'notes');
  const hasBody = (req.headers.get('content-length') ?? '0') !== '0' || req.headers.has('content-type');
  const opts = hasBody ? await parseJson(req, sendDigestSchema) : {};
  const result = await sendNoteDigest(actor, await slugOf(params), opts);
  return NextResponse.json(result, { status: 201 });
});
