'use client';
import { useEffect, useRef, useState } from 'react';
import { useRouter } from 'next/navigation';
import { ApiError, sendJson } from '@/components/fetcher';

export function RevertButton({ slug, toRevision, baseRevision }: { slug: string; toRevision: number; baseRevision: number }) {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const confirmRef = useRef<HTMLButtonElement>(null);
  const startRef = useRef<HTMLButtonElement>(null);
  const [moved, setMoved] = useState(false);
  // Asking moves the focus to the confirming button; "Keep as is" brings it back.
  useEffect(() => {
    if (!moved) return;
    (confirming ? confirmRef : startRef).current?.focus();
    setMoved(false);
  }, [moved, confirming]);

  async function revert() {
    setBusy(true);
    setError(null);
    try {
      await sendJson(`/api/species/${slug}/revert`, 'POST', { toRevision, baseRevision, publish: true });
      setConfirming(false);
      // The history page then names the new revision in a notice that takes the focus.
      router.push(`/species/${slug}/history?reverted=${toRevision}`);
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? e.body.message : 'The server could not be reached.');
    } finally {
      setBusy(false);
    }
  }

  if (!confirming) {
    return (
      <button
        ref={startRef}
        type="button"
        className="btn-secondary"
        onClick={() => {
          setConfirming(true);
          setMoved(true);
        }}
        aria-label={`Revert to revision ${toRevision}`}
      >
        Revert to this
      </button>
    );
  }
  return (
    <span className="flex flex-wrap items-center gap-2">
      <button ref={confirmRef} type="button" className="btn-danger" disabled={busy} onClick={() => void revert()}>
        Publish a copy of revision {toRevision}
      </button>
      <button
        type="button"
        className="btn-secondary"
        onClick={() => {
          setConfirming(false);
          setMoved(true);
        }}
      >
        Keep as is
      </button>
      {error && (
        <span role="alert" className="field-error">
          {error}
        </span>
      )}
    </span>
  );
}
