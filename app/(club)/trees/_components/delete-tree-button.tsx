'use client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { mutate } from 'swr';
import { sendJson } from '@/components/fetcher';
import { useOnline } from '@/components/offline/offline-banner';

export function DeleteTreeButton({ id, name }: { id: string; name: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const online = useOnline();
  async function onClick() {
    if (!window.confirm(`Delete “${name}” and its photos? Answers about it stay in your log.`)) return;
    setBusy(true);
    setError(null);
    try {
      await sendJson(`/api/trees/${id}`, 'DELETE');
      await mutate('/api/trees');
      router.push('/trees');
      router.refresh();
    } catch (e) {
      setError((e as Error).message);
      setBusy(false);
    }
  }
  return (
    <>
      <button
        type="button"
        className="btn-danger"
        onClick={onClick}
        disabled={busy || !online}
        title={online ? undefined : 'Deleting a tree needs a connection'}
      >
        Delete
      </button>
      {error ? (
        <p role="alert" className="field-error w-full">
          {error}
        </p>
      ) : null}
    </>
  );
}
