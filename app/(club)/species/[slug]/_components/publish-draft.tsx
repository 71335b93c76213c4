'use client';
import { useEffect, useRef, useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { ApiError, sendJson } from '@/components/fetcher';
import { traitLabels } from '@/lib/species/labels';

/**
 * On the preview of the newest draft: publish exactly what is shown, as a new published
 * revision (history is never rewritten). Missing citations come back named, with a way to fix them.
 */
export function PublishDraft({ slug, revision }: { slug: string; revision: number }) {
  const router = useRouter();
  const [busy, setBusy] = useState(false);
  const [error, setError] = useState<{ text: string; fields: string[] } | null>(null);
  const errorRef = useRef<HTMLDivElement>(null);
  // Focus the refusal once it is on screen (after the render that shows it, not on a guessed frame).
  useEffect(() => {
    if (error) errorRef.current?.focus();
  }, [error]);

  async function publish() {
    setBusy(true);
    setError(null);
    try {
      await sendJson(`/api/species/${slug}/revert`, 'POST', {
        toRevision: revision,
        baseRevision: revision,
        publish: true,
        summary: `Published draft revision ${revision}`,
      });
      router.push(`/species/${slug}?published=${revision}`);
      router.refresh();
    } catch (e) {
      const fields =
        e instanceof ApiError
          ? Object.keys(e.body.fields ?? {}).map((k) => {
              const t = k.replace(/^record\.traits\./, '').replace(/\.citation$/, '');
              return `the citation of ${traitLabels[t as keyof typeof traitLabels] ?? t}`;
            })
          : [];
      setError({ text: e instanceof ApiError ? e.body.message : 'The server could not be reached; try again.', fields });
      setBusy(false);
    }
  }

  return (
    <div className="space-y-2">
      <button type="button" className="btn-primary" disabled={busy} onClick={() => void publish()} data-testid="publish-draft">
        {busy ? 'Publishing…' : 'Publish this draft'}
      </button>
      {error && (
        <div ref={errorRef} tabIndex={-1} role="alert" className="rounded-lg border border-clay-500 bg-clay-100 p-3 text-clay-700">
          <p>{error.text}</p>
          {error.fields.length > 0 && (
            <p className="mt-1">
              Missing: {error.fields.join(', ')}. <Link href={`/species/${slug}/edit`}>Add them in the editor</Link>.
            </p>
          )}
        </div>
      )}
    </div>
  );
}
