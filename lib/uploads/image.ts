import sharp from 'sharp';
import { fileTypeFromBuffer } from 'file-type';
import { AppError } from '@/lib/errors';
import type { StorageExt } from '@/lib/storage/types';

// Checks and re-encodes one uploaded photo, in memory. Nothing here touches the disk: a file
// is only stored after it has passed every check and been re-encoded.

export const MAX_PHOTO_BYTES = 10 * 1024 * 1024;
export const MAX_PHOTOS_PER_ITEM = 6;
/** Decoding cost grows with pixels, not bytes: a tiny file can claim a huge canvas. */
const MAX_INPUT_PIXELS = 50_000_000;
/** Longest edge kept after re-encoding, and of the list thumbnail. */
export const MAX_EDGE_PX = 2560;
const THUMB_EDGE_PX = 400;

const accepted = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
} as const satisfies Record<string, StorageExt>;
export type AcceptedMime = keyof typeof accepted;

export interface ProcessedPhoto {
  mime: AcceptedMime;
  ext: StorageExt;
  data: Buffer;
  width: number;
  height: number;
  thumb: Buffer;
}

const fileError = (code: `${'invalid' | 'unsupported_media_type' | 'payload_too_large'}:${string}`, message: string) =>
  new AppError(code, message, { file: [message] });

sharp.cache(false);

/** The real type of the bytes (magic numbers), never the name or the declared type. */
export async function sniffPhotoType(buf: Buffer): Promise<AcceptedMime | null> {
  const type = await fileTypeFromBuffer(buf);
  if (!type || !(type.mime in accepted)) return null;
  return type.mime as AcceptedMime;
}

export async function processPhoto(buf: Buffer): Promise<ProcessedPhoto> {
  if (buf.length === 0) throw fileError('invalid:file', 'The file is empty.');
  if (buf.length > MAX_PHOTO_BYTES) throw fileError('payload_too_large:file', 'The photo is larger than 10 MB.');
  const mime = await sniffPhotoType(buf);
  if (!mime) throw fileError('unsupported_media_type:file', 'Only JPEG, PNG and WebP photos are accepted.');

  // Header first: metadata() reads width and height from the file's header and decodes no pixel,
  // so the size is judged here with our own message; the decode below carries the limit as well.
  let meta: sharp.Metadata;
  try {
    meta = await sharp(buf, { limitInputPixels: false }).metadata();
  } catch {
    throw fileError('invalid:file', 'The photo could not be read: the file looks damaged.');
  }
  if (!meta.width || !meta.height) throw fileError('invalid:file', 'The photo has no size in its header.');
  if (meta.width * meta.height > MAX_INPUT_PIXELS) {
    throw fileError('invalid:file_pixels', `The photo is ${meta.width} × ${meta.height} pixels; the limit is ${MAX_INPUT_PIXELS / 1_000_000} megapixels.`);
  }

  const ext = accepted[mime];
  try {
    // rotate() applies the camera's orientation before the metadata (EXIF, GPS position, XMP) is
    // dropped: sharp writes no input metadata unless asked to.
    const base = () => sharp(buf, { limitInputPixels: MAX_INPUT_PIXELS, failOn: 'error' }).rotate();
    const resized = base().resize({ width: MAX_EDGE_PX, height: MAX_EDGE_PX, fit: 'inside', withoutEnlargement: true });
    const encoded =
      ext === 'jpg' ? resized.jpeg({ quality: 85, mozjpeg: true }) : ext === 'png' ? resized.png({ compressionLevel: 9 }) : resized.webp({ quality: 85 });
    const { data, info } = await encoded.toBuffer({ resolveWithObject: true });
    const thumb = await base()
      .resize({ width: THUMB_EDGE_PX, height: THUMB_EDGE_PX, fit: 'inside', withoutEnlargement: true })
      .webp({ quality: 75 })
      .toBuffer();
    return { mime, ext, data, width: info.width, height: info.height, thumb };
  } catch {
    throw fileError('invalid:file', 'The photo could not be read: the file looks damaged.');
  }
}
