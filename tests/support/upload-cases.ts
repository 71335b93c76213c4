import type { Client } from './http-client';
import { gifJsPolyglot, htmlRenamedPng, hugePixelPng, oversizeJpegLike, pngPhoto, svgWithScript } from './images';

// The photo uploads every store must refuse, with the status and without storing anything: run
// against the local directory (tests/integration/uploads.test.ts) and against the S3 bucket of the
// cluster (tests/cluster/photos.test.ts), the path and NUL names included.

/** A multipart upload as the photo form sends it. */
export async function upload(c: Client, fields: Record<string, string>, file: Buffer, name: string, type: string) {
  const form = new FormData();
  for (const [k, v] of Object.entries(fields)) form.append(k, v);
  form.append('file', new Blob([new Uint8Array(file)], { type }), name);
  const res = await c.request('/api/uploads', { method: 'POST', body: form });
  const text = await res.text();
  return { status: res.status, body: text ? JSON.parse(text) : null };
}

export interface RefusedUpload {
  label: string;
  make: () => Buffer | Promise<Buffer>;
  name: string;
  type: string;
  status: number;
}

export const refusedUploads: RefusedUpload[] = [
  { label: 'an SVG with a script', make: () => svgWithScript, name: 'shoot.svg', type: 'image/svg+xml', status: 415 },
  { label: 'an SVG claiming to be a PNG', make: () => svgWithScript, name: 'shoot.png', type: 'image/png', status: 415 },
  { label: 'HTML renamed .png', make: () => htmlRenamedPng, name: 'shoot.png', type: 'image/png', status: 415 },
  { label: 'a GIF/JS polyglot', make: () => gifJsPolyglot(), name: 'shoot.gif', type: 'image/gif', status: 415 },
  { label: 'a 20000 × 20000 PNG', make: () => hugePixelPng(), name: 'huge.png', type: 'image/png', status: 422 },
  { label: 'a file over 10 MB', make: () => oversizeJpegLike(), name: 'big.jpg', type: 'image/jpeg', status: 413 },
  { label: 'a body far over 10 MB', make: () => oversizeJpegLike(25 * 1024 * 1024), name: 'bigger.jpg', type: 'image/jpeg', status: 413 },
  // A good photo under a name that holds a path or a control character: refused by its name
  // before any store sees it, so nothing lands where the name points (a file or a bucket key).
  { label: 'a path-traversal name', make: () => pngPhoto(), name: '../../../../../tmp/cw-evil-upload.png', type: 'image/png', status: 400 },
  { label: 'a Windows path-traversal name', make: () => pngPhoto(), name: '..\\..\\..\\cw-evil-upload.png', type: 'image/png', status: 400 },
  { label: 'an absolute-path name', make: () => pngPhoto(), name: '/etc/cw-evil-upload.png', type: 'image/png', status: 400 },
  { label: 'a NUL-byte name', make: () => pngPhoto(), name: 'shoot.png\u0000.html', type: 'image/png', status: 400 },
];

/** Where the path names above would put a file if a store followed them. */
export const pathNameTargets = ['/tmp/cw-evil-upload.png', '/etc/cw-evil-upload.png'];
