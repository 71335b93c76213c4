'use client';
import { useId, useRef, useState } from 'react';
import useSWR from 'swr';
import type { PhotoDto } from '@/lib/data/photos';
import { fetcher, sendJson } from '@/components/fetcher';
import { useOnline } from '@/components/offline/offline-banner';
import { ACCEPTED_TYPES, MAX_BYTES, MAX_PER_ITEM, formatBytes, uploadPhoto, type UploadTarget } from './upload';

interface Job {
  key: string;
  name: string;
  size: number;
  status: 'waiting' | 'uploading' | 'done' | 'failed';
  progress: number;
  message?: string;
}

/**
 * The photos of a tree or an answer, with an uploader for the owner. Each file is its own
 * request with its own progress and error, so one refused file never costs the others.
 */
export function PhotoPanel({ target, initial, canAdd, label }: { target: UploadTarget; initial: PhotoDto[]; canAdd: boolean; label: string }) {
  const online = useOnline();
  const offlineId = useId();
  const key = `/api/uploads?${'treeId' in target ? `treeId=${encodeURIComponent(target.treeId)}` : `answerId=${encodeURIComponent(target.answerId)}`}`;
  const { data, mutate } = useSWR<{ items: PhotoDto[] }>(key, fetcher, { fallbackData: { items: initial } });
  const photos = data?.items ?? [];
  const [jobs, setJobs] = useState<Job[]>([]);
  const [notice, setNotice] = useState<string | null>(null);
  const inputRef = useRef<HTMLInputElement>(null);

  const update = (k: string, patch: Partial<Job>) => setJobs((js) => js.map((j) => (j.key === k ? { ...j, ...patch } : j)));

  async function onFiles(files: FileList | null) {
    if (!files || files.length === 0) return;
    const list = Array.from(files);
    let free = MAX_PER_ITEM - photos.length - jobs.filter((j) => j.status === 'waiting' || j.status === 'uploading').length;
    const fresh: { job: Job; file: File | null }[] = list.map((file, i) => {
      const base = { key: `${Date.now()}-${i}-${file.name}`, name: file.name, size: file.size, progress: 0 };
      if (!ACCEPTED_TYPES.includes(file.type)) {
        return { job: { ...base, status: 'failed', message: 'Only JPEG, PNG and WebP photos are accepted.' }, file: null };
      }
      if (file.size > MAX_BYTES) return { job: { ...base, status: 'failed', message: 'The photo is larger than 10 MB.' }, file: null };
      if (free <= 0) return { job: { ...base, status: 'failed', message: `Up to ${MAX_PER_ITEM} photos here: remove one first.` }, file: null };
      free -= 1;
      return { job: { ...base, status: 'waiting' }, file };
    });
    setJobs((js) => [...fresh.map((f) => f.job), ...js.filter((j) => j.status !== 'done')]);
    if (inputRef.current) inputRef.current.value = '';
    for (const { job, file } of fresh) {
      if (!file) continue;
      update(job.key, { status: 'uploading' });
      const outcome = await uploadPhoto(file, target, (p) => update(job.key, { progress: p }));
      if (outcome.ok) {
        update(job.key, { status: 'done', progress: 1 });
        await mutate((d) => ({ items: [...(d?.items ?? []).filter((x) => x.id !== outcome.photo.id), outcome.photo] }), { revalidate: false });
      } else {
        update(job.key, { status: 'failed', message: outcome.message });
      }
    }
    await mutate();
  }

  async function remove(p: PhotoDto) {
    if (!window.confirm('Remove this photo?')) return;
    setNotice(null);
    try {
      await sendJson(`/api/uploads/${p.id}`, 'DELETE');
      await mutate();
      setNotice('Photo removed.');
    } catch (e) {
      setNotice((e as Error).message);
    }
  }

  return (
    <div className="space-y-4" data-testid="photo-panel">
      {photos.length === 0 ? <p className="text-stone-700">No photos yet.</p> : null}
      <ul className="grid grid-cols-2 gap-3 sm:grid-cols-3 lg:grid-cols-4" data-testid="photo-list">
        {photos.map((p, i) => (
          <li key={p.id} className="overflow-hidden rounded-card border border-stone-200 bg-white" data-testid="photo">
            <a href={p.url} target="_blank" rel="noopener" className="block">
              {/* Thumbnails are already small WebP files made on upload. */}
              {/* eslint-disable-next-line @next/next/no-img-element */}
              <img src={p.thumbUrl} alt={`${label}, photo ${i + 1} of ${photos.length}`} className="aspect-square w-full object-cover" loading="lazy" />
            </a>
            <div className="flex items-center justify-between gap-2 px-2 py-1 text-xs text-stone-600">
              <span>
                {p.createdAt.slice(0, 10)} · {p.width}×{p.height}
              </span>
              {p.mine ? (
                <button
                  type="button"
                  className="min-h-target px-2 text-sm text-clay-700 underline disabled:no-underline disabled:opacity-60"
                  disabled={!online}
                  title={online ? undefined : 'Removing a photo needs a connection'}
                  onClick={() => void remove(p)}
                  aria-label={`Remove photo ${i + 1}`}
                >
                  Remove
                </button>
              ) : null}
            </div>
          </li>
        ))}
      </ul>
      {canAdd ? (
        <div className="space-y-3">
          <label
            className={`btn-secondary cursor-pointer has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-offset-2 has-[:focus-visible]:outline-bark-600 ${photos.length >= MAX_PER_ITEM || !online ? 'pointer-events-none opacity-60' : ''}`}
          >
            Add photos
            <input
              ref={inputRef}
              type="file"
              accept={ACCEPTED_TYPES.join(',')}
              multiple
              className="sr-only"
              disabled={photos.length >= MAX_PER_ITEM || !online}
              aria-describedby={online ? undefined : offlineId}
              onChange={(e) => void onFiles(e.target.files)}
              data-testid="photo-input"
            />
          </label>
          {!online && (
            <p id={offlineId} className="text-sm font-medium text-stone-900" data-testid="photos-offline">
              Adding and removing photos needs a connection.
            </p>
          )}
          <p className="text-sm text-stone-700">
            JPEG, PNG or WebP, up to 10 MB each, {MAX_PER_ITEM} per item ({photos.length} used). Photos are re-encoded on upload: this removes the location and
            camera details stored in the file, and large photos are scaled to 2560 px on the longest side.
          </p>
        </div>
      ) : null}
      {jobs.length > 0 ? (
        <ul className="space-y-2" aria-live="polite" data-testid="upload-jobs">
          {jobs.map((j) => (
            <li
              key={j.key}
              className={`rounded-lg border p-2 text-sm ${j.status === 'failed' ? 'border-clay-500 bg-clay-100' : 'border-stone-200 bg-white'}`}
              data-testid="upload-job"
              data-status={j.status}
            >
              <div className="flex flex-wrap justify-between gap-2">
                <span className="break-all font-medium">{j.name}</span>
                <span className="text-stone-600">{formatBytes(j.size)}</span>
              </div>
              {j.status === 'uploading' || j.status === 'waiting' ? (
                <progress className="mt-1 h-2 w-full" max={1} value={j.progress} aria-label={`Uploading ${j.name}`} />
              ) : null}
              {j.status === 'done' ? <p className="text-moss-800">Uploaded.</p> : null}
              {j.status === 'failed' ? (
                <p className="text-clay-700" role="alert">
                  Not uploaded: {j.message}
                </p>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      <p role="status" className="text-sm">
        {notice}
      </p>
    </div>
  );
}
