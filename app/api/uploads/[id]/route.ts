import { NextResponse } from 'next/server';
import { parseQuery, route } from '@/lib/http/route';
import { requireUser } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { deletePhoto, readPhoto } from '@/lib/data/photos';
import { photoIdSchema, photoSizeSchema } from '@/lib/validation/uploads';

type Params = { id: string };

async function idOf(params: Promise<Params>) {
  const { id } = await params;
  if (!photoIdSchema.safeParse(id).success) throw new AppError('not_found:photo', 'No such photo.');
  return id;
}

// The image itself, only for people allowed to see its tree or answer. `?size=thumb` for lists.
export const GET = route<Params>(async (req, { params }) => {
  const viewer = await requireUser();
  const { size } = parseQuery(req, photoSizeSchema);
  const photo = await readPhoto(viewer, await idOf(params), size);
  return new NextResponse(new Uint8Array(photo.data), {
    status: 200,
    headers: {
      'content-type': photo.mime,
      'content-length': String(photo.data.length),
      'x-content-type-options': 'nosniff',
      'content-disposition': 'inline',
      'cache-control': 'private, max-age=3600',
      'content-security-policy': "default-src 'none'; sandbox",
      'cross-origin-resource-policy': 'same-origin',
    },
  });
});

export const DELETE = route<Params>(async (_req, { params }) => {
  const actor = await requireUser();
  await deletePhoto(actor, await idOf(params));
  return new NextResponse(null, { status: 204 });
});
