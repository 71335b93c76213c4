'use client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { ApiError, sendJson } from '@/components/fetcher';

export function RevertButton({ slug, toRevision, baseRevision }: { slug: string; toRevision: number; baseRevision: number }) {
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<string | null>(null);

  async function revert() {
    setBusy(true);
    setError(null);
    try {
      await sendJson(`/api/species/${slug}/revert`, 'POST', { toRevision, baseRevision, publish: true });
      setConfirming(false);
      router.refresh();
    } catch (e) {
      setError(e instanceof ApiError ? e.body.message : 'The server could not be reached.');
    } finally {
      setBusy(false);
    }
  }

  if (!confirming) {
    return (
      <button type="button" className="btn-secondary" onClick={() => setConfirming(true)} aria-label={`Revert to revision ${toRevision}`}>
        Revert to this
      </button>
    );
  }
  return (
    <span className="flex flex-wrap items-center gap-2">
      <button type="button" className="btn-danger" disabled={busy} onClick={() => void revert()}>
        Publish a copy of revision {toRevision}
      </button>
      <button type="button" className="btn-secondary" onClick={() => setConfirming(false)}>Keep as is</button>
      {error && <span role="alert" className="field-error">{error}</span>}
    </span>
  );
}
