'use client';

import { useRouter } from 'next/navigation';
import { useState } from 'react';
import type { ImportPreview } from '@/lib/data/season';

type Scope = 'club' | 'member';

/** Choose a CSV, see what it holds and every row error, then import. */
export function RecordImport({ canClub }: { canClub: boolean }) {
  const router = useRouter();
  const [scope, setScope] = useState<Scope>(canClub ? 'club' : 'member');
  const [csv, setCsv] = useState('');
  const [preview, setPreview] = useState<ImportPreview | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function send(path: string) {
    setBusy(true);
    setMessage(null);
    const res = await fetch(path, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ scope, csv }) });
    const body = await res.json().catch(() => ({}));
    setBusy(false);
    return { res, body };
  }

  return (
    <section aria-labelledby="import" className="card space-y-4" data-testid="record-import">
      <h2 id="import" className="text-xl">
        Import temperatures
      </h2>
      <p className="text-sm text-stone-700">
        A CSV of <code>date,tmin,tmax</code> in °C, or a NOAA GHCN-Daily station file (values flagged by NOAA’s quality checks are left out). Days already in
        the record are replaced.
      </p>
      <fieldset className="space-y-1">
        <legend className="font-medium">Record</legend>
        {canClub ? (
          <label className="mr-4 inline-flex items-center gap-2">
            <input type="radio" name="scope" checked={scope === 'club'} onChange={() => setScope('club')} /> The club’s
          </label>
        ) : null}
        <label className="inline-flex items-center gap-2">
          <input type="radio" name="scope" checked={scope === 'member'} onChange={() => setScope('member')} /> My own
        </label>
      </fieldset>
      <label className="block space-y-1">
        <span className="font-medium">CSV file</span>
        <input
          type="file"
          accept=".csv,text/csv"
          data-testid="record-file"
          className="block max-w-full"
          onChange={async (e) => {
            const f = e.target.files?.[0];
            setPreview(null);
            setCsv(f ? await f.text() : '');
          }}
        />
      </label>
      <div className="flex flex-wrap gap-3">
        <button
          type="button"
          className="btn-secondary"
          disabled={!csv || busy}
          data-testid="record-preview"
          onClick={async () => {
            const { res, body } = await send('/api/season/records/preview');
            if (res.ok) setPreview(body.preview);
            else setMessage(body.error?.message ?? 'Could not read the file.');
          }}
        >
          Preview
        </button>
        <button
          type="button"
          className="btn-primary"
          disabled={!preview || preview.errors.length > 0 || busy}
          data-testid="record-import-button"
          onClick={async () => {
            const { res, body } = await send('/api/season/records/import');
            if (res.ok) {
              setMessage(`Imported ${body.imported} days (${body.replaced} replaced).`);
              setPreview(null);
              router.refresh();
            } else setMessage(body.error?.message ?? 'Could not import the file.');
          }}
        >
          Import
        </button>
      </div>
      {message ? (
        <p role="status" data-testid="record-message">
          {message}
        </p>
      ) : null}
      {preview ? (
        <div className="space-y-2" data-testid="record-preview-result">
          <p>{`${preview.format === 'ghcn' ? `GHCN-Daily station ${preview.station}` : 'Plain CSV'}: ${preview.dayCount} days, ${preview.firstDay ?? '—'} to ${preview.lastDay ?? '—'}, heat sum ${preview.heatSum} °C days; replaces ${preview.replaces}.`}</p>
          {preview.errors.length ? (
            <div role="alert">
              <p className="font-semibold text-red-800">{`${preview.errors.length} row error(s): fix them and preview again.`}</p>
              <ul className="list-disc pl-5">
                {preview.errors.slice(0, 50).map((e) => (
                  <li key={`${e.line}-${e.message}`}>{`Line ${e.line}: ${e.message}`}</li>
                ))}
              </ul>
            </div>
          ) : null}
          {preview.skipped.length ? (
            <details>
              <summary>{`${preview.skipped.length} value(s) left out`}</summary>
              <ul className="list-disc pl-5 text-sm">
                {preview.skipped.slice(0, 50).map((e) => (
                  <li key={`${e.line}-${e.message}`}>{`Line ${e.line}: ${e.message}`}</li>
                ))}
              </ul>
            </details>
          ) : null}
        </div>
      ) : null}
    </section>
  );
}
