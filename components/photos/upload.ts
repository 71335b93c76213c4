'use client';
import type { PhotoDto } from '@/lib/data/photos';

export type UploadTarget = { treeId: string } | { answerId: string };

export type UploadOutcome = { ok: true; photo: PhotoDto } | { ok: false; message: string };

export const ACCEPTED_TYPES = ['image/jpeg', 'image/png', 'image/webp'];
export const MAX_BYTES = 10 * 1024 * 1024;
export const MAX_PER_ITEM = 6;

/** One photo, one request: XMLHttpRequest because fetch cannot report upload progress. */
export function uploadPhoto(file: File, target: UploadTarget, onProgress: (fraction: number) => void): Promise<UploadOutcome> {
  return new Promise((resolve) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', '/api/uploads');
    xhr.setRequestHeader('accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress(e.loaded / e.total);
    };
    xhr.onload = () => {
      let body: { photo?: PhotoDto; error?: { message: string; fields?: Record<string, string[]> } } | null = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        /* not JSON */
      }
      if (xhr.status === 201 && body?.photo) return resolve({ ok: true, photo: body.photo });
      const message = body?.error?.fields?.file?.[0] ?? body?.error?.message ?? `The upload failed (${xhr.status}).`;
      resolve({ ok: false, message });
    };
    xhr.onerror = () => resolve({ ok: false, message: 'The connection failed. Check the network and try this photo again.' });
    const form = new FormData();
    if ('treeId' in target) form.append('treeId', target.treeId);
    else form.append('answerId', target.answerId);
    form.append('file', file);
    xhr.send(form);
  });
}

export function formatBytes(n: number): string {
  if (n < 1024) return `${n} B`;
  if (n < 1024 * 1024) return `${Math.round(n / 1024)} KB`;
  return `${(n / (1024 * 1024)).toFixed(1)} MB`;
}
