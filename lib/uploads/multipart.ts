import { AppError } from '@/lib/errors';
import { MAX_PHOTO_BYTES } from './image';

// A photo upload is one multipart request per file. The body is read with a cap, so a huge
// request is refused with 413 after at most a bounded read, and never buffered whole.

/** Room for the multipart boundaries and the small text fields beside the file. */
const ENVELOPE_BYTES = 64 * 1024;
export const MAX_UPLOAD_BODY_BYTES = MAX_PHOTO_BYTES + ENVELOPE_BYTES;
/** How much of an oversize body is read and discarded so that the client sees the 413. */
const DRAIN_LIMIT_BYTES = 64 * 1024 * 1024;

const tooLarge = () => new AppError('payload_too_large:file', 'The photo is larger than 10 MB.', { file: ['The photo is larger than 10 MB.'] });

async function drain(reader: ReadableStreamDefaultReader<Uint8Array>, already: number) {
  let total = already;
  try {
    while (total < DRAIN_LIMIT_BYTES) {
      const { done, value } = await reader.read();
      if (done) return;
      total += value.length;
    }
    await reader.cancel();
  } catch {
    /* the client went away */
  }
}

export async function readUploadForm(req: Request): Promise<FormData> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^multipart\/form-data;/i.test(type)) {
    throw new AppError('unsupported_media_type:body', 'Send the photo as multipart/form-data.');
  }
  const declared = Number(req.headers.get('content-length'));
  const reader = req.body?.getReader();
  if (!reader) throw new AppError('bad_request:body', 'The request has no body.', { file: ['Choose a photo.'] });
  if (Number.isFinite(declared) && declared > MAX_UPLOAD_BODY_BYTES) {
    await drain(reader, 0);
    throw tooLarge();
  }
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.length;
    if (total > MAX_UPLOAD_BODY_BYTES) {
      await drain(reader, total);
      throw tooLarge();
    }
    chunks.push(value);
  }
  try {
    return await new Response(Buffer.concat(chunks), { headers: { 'content-type': type } }).formData();
  } catch {
    throw new AppError('bad_request:body', 'The upload could not be read as a form.', { file: ['The upload could not be read.'] });
  }
}
