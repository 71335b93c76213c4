'use client';
import { useState } from 'react';
import { fetcher, ApiError } from '@/components/fetcher';
import type { ResultComparison } from '@/lib/wizard/compare';
import { useOnline } from '@/components/offline/offline-banner';

interface Rerun {
  comparison: ResultComparison | null;
  speciesMissing: boolean;
  current: { headline: string } | null;
}

const show = (v: unknown) => (v === null || v === undefined ? 'none' : typeof v === 'object' ? JSON.stringify(v) : String(v));

/** Re-run the stored inputs with today's rules and species data: what changed and why. */
export function RerunPanel({ id }: { id: string }) {
  const [data, setData] = useState<Rerun | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const online = useOnline();
  async function run() {
    setBusy(true);
    setError(null);
    try {
      setData(await fetcher<Rerun>(`/api/answers/${id}/rerun`));
    } catch (e) {
      setError(e instanceof ApiError ? e.message : 'Could not re-run.');
    } finally {
      setBusy(false);
    }
  }
  const c = data?.comparison;
  return (
    <section className="card space-y-3" aria-labelledby="rerun-h" data-testid="rerun">
      <h2 id="rerun-h" className="text-lg">
        Check against today’s rules
      </h2>
      <p className="text-stone-700">Runs the same observation through today’s rules and species record and shows any difference.</p>
      <button type="button" className="btn-secondary" onClick={run} disabled={busy || !online} aria-describedby={online ? undefined : 'rerun-offline'}>
        {busy ? 'Checking…' : 'Re-run this answer'}
      </button>
      {!online && (
        <p id="rerun-offline" className="text-stone-700">
          Checking against today’s rules needs a connection.
        </p>
      )}
      {error && (
        <p role="alert" className="field-error">
          {error}
        </p>
      )}
      {data?.speciesMissing && <p role="status">This species is no longer published, so the answer cannot be re-run.</p>}
      {c && (
        <div role="status" className="space-y-2" data-testid="rerun-result">
          <p className="font-semibold">{c.same ? 'Same answer today.' : `Today’s answer: ${data!.current!.headline}`}</p>
          {c.changes.length > 0 && (
            <ul className="list-disc pl-5">
              {c.changes.map((ch) => (
                <li key={ch.field}>
                  {ch.label}: {show(ch.before)} → {show(ch.after)}
                </li>
              ))}
            </ul>
          )}
          <ul className="list-disc space-y-1 pl-5">
            {c.why.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      )}
    </section>
  );
}
