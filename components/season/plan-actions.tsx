'use client';

import { useRouter } from 'next/navigation';
import { useState, useTransition } from 'react';

// "Done" on a task and "Seen today" on a shoot state: both record an observation that
// re-anchors the tree's plan, then the page is read again.
export function ObservationButton({ treeId, body, label, testId }: { treeId: string; body: { task?: string; shoot?: string }; label: string; testId: string }) {
  const router = useRouter();
  const [pending, start] = useTransition();
  const [error, setError] = useState<string | null>(null);
  return (
    <span className="inline-flex flex-col">
      <button
        type="button"
        className="btn-secondary"
        data-testid={testId}
        disabled={pending}
        onClick={() =>
          start(async () => {
            setError(null);
            const res = await fetch(`/api/trees/${encodeURIComponent(treeId)}/observations`, {
              method: 'POST',
              headers: { 'content-type': 'application/json' },
              body: JSON.stringify(body),
            });
            if (!res.ok) setError('Could not save that. Try again.');
            else router.refresh();
          })
        }
      >
        {pending ? 'Saving…' : label}
      </button>
      {error ? (
        <span role="alert" className="text-sm text-red-800">
          {error}
        </span>
      ) : null}
    </span>
  );
}
