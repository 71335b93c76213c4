import { NextResponse } from 'next/server';
import { parseQuery, parseWith, route } from '@/lib/http/route';
import { requireUser } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { addPhoto, assertCanAddPhoto, listPhotos } from '@/lib/data/photos';
import { processPhoto } from '@/lib/uploads/image';
import { MAX_UPLOAD_BODY_BYTES, readUploadForm } from '@/lib/uploads/multipart';
import { isAcceptableUploadName, photoTargetSchema } from '@/lib/validation/uploads';

// GET ?treeId= | ?answerId=: the photos of an item the viewer may see.
export const GET = route(async (req) => {
  const viewer = await requireUser();
  const target = parseQuery(req, photoTargetSchema);
  return NextResponse.json({ items: await listPhotos(viewer, target) });
});

// POST multipart/form-data: `file` plus `treeId` or `answerId`. One photo per request.
export const POST = route(
  { maxBytes: MAX_UPLOAD_BODY_BYTES, tooLarge: { subject: 'file', field: 'file', message: 'The photo is larger than 10 MB.' } },
  async (req) => {
    const actor = await requireUser();
    const form = await readUploadForm(req);
    const target = parseWith(photoTargetSchema, { treeId: form.get('treeId') ?? undefined, answerId: form.get('answerId') ?? undefined }, 400);
    const file = form.get('file');
    if (!(file instanceof File)) throw new AppError('bad_request:file', 'Choose a photo to upload.', { file: ['Choose a photo to upload.'] });
    if (!isAcceptableUploadName(file.name)) {
      throw new AppError('bad_request:file', 'The file name is not acceptable: send the photo under its plain name.', {
        file: ['The file name holds a path or control characters.'],
      });
    }
    await assertCanAddPhoto(actor, target);
    const processed = await processPhoto(Buffer.from(await file.arrayBuffer()));
    const photo = await addPhoto(actor, target, processed);
    return NextResponse.json({ photo }, { status: 201 });
  },
);
