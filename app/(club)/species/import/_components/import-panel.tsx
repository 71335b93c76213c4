'use client';
import { useState } from 'react';
import Link from 'next/link';
import { ApiError, sendJson } from '@/components/fetcher';
import type { ImportPreviewItem } from '@/lib/data/species-editorial';
import { MAX_IMPORT_FILES } from '@/lib/validation/species';

type Upload = { name: string; content: string };

const actionText = { create: 'New species', update: 'New revision of an existing species', unchanged: 'Same as the latest revision: skipped' };

export function ImportPanel() {
  const [files, setFiles] = useState<Upload[]>([]);
  const [preview, setPreview] = useState<ImportPreviewItem[] | null>(null);
  const [publish, setPublish] = useState(false);
  const [summary, setSummary] = useState('');
  const [busy, setBusy] = useState(false);
  const [message, setMessage] = useState<{ tone: 'ok' | 'error'; text: string } | null>(null);
  const [done, setDone] = useState(false);

  async function choose(list: FileList | null) {
    setPreview(null);
    setMessage(null);
    setDone(false);
    if (!list?.length) return setFiles([]);
    if (list.length > MAX_IMPORT_FILES) return setMessage({ tone: 'error', text: `Choose at most ${MAX_IMPORT_FILES} files at a time.` });
    const read = await Promise.all([...list].map(async (f) => ({ name: f.name, content: await f.text() })));
    setFiles(read);
    setBusy(true);
    try {
      const res = await sendJson<{ files: ImportPreviewItem[] }>('/api/species/import/preview', 'POST', { files: read });
      setPreview(res.files);
    } catch (e) {
      setMessage({ tone: 'error', text: e instanceof ApiError ? e.body.message : 'The server could not be reached.' });
    } finally {
      setBusy(false);
    }
  }

  async function commit() {
    setBusy(true);
    setMessage(null);
    try {
      const res = await sendJson<{ results: unknown[]; skipped: ImportPreviewItem[] }>('/api/species/import', 'POST', {
        files,
        publish,
        summary,
        skipInvalid: bad > 0,
      });
      const left = res.skipped.length ? ` ${res.skipped.length} file(s) with errors were left out; they are listed below.` : '';
      setMessage({ tone: 'ok', text: `Imported ${res.results.length} file(s) ${publish ? 'and published them' : 'as drafts'}.${left}` });
      // Keep the files that were left out on screen, with their messages, to fix and choose again.
      setPreview(res.skipped.length ? res.skipped : null);
      setFiles([]);
      setDone(true);
    } catch (e) {
      setMessage({ tone: 'error', text: e instanceof ApiError ? e.body.message : 'The server could not be reached.' });
    } finally {
      setBusy(false);
    }
  }

  const bad = preview?.filter((p) => !p.ok).length ?? 0;
  const writable = preview?.filter((p) => p.ok && p.action !== 'unchanged').length ?? 0;

  return (
    <div className="space-y-6">
      <div className="card space-y-3">
        <label htmlFor="import-files" className="field-label">
          Species files (.md, front matter and care notes)
        </label>
        <input
          id="import-files"
          type="file"
          accept=".md,text/markdown"
          multiple
          className="field-input"
          onChange={(e) => void choose(e.target.files)}
          data-testid="import-files"
        />
        <p className="text-sm text-stone-700">Nothing is written until you confirm below. Files in the format of the download work as they are.</p>
      </div>

      {busy && <p role="status">Checking…</p>}
      {message && (
        <p
          role="alert"
          data-testid="import-message"
          className={`rounded-lg border p-3 ${message.tone === 'error' ? 'border-clay-500 bg-clay-100 text-clay-700' : 'border-moss-500 bg-moss-50 text-moss-900'}`}
        >
          {message.text} {message.tone === 'ok' && <Link href="/species">Back to the species</Link>}
        </p>
      )}

      {preview && (
        <section aria-labelledby="preview-h" className="space-y-3">
          <h2 id="preview-h" className="text-xl">
            Preview
          </h2>
          <ul className="space-y-3" data-testid="import-preview">
            {preview.map((p) => (
              <li key={p.name} className={`card min-w-0 break-words ${p.ok ? '' : 'border-clay-500'}`}>
                <p className="font-medium [overflow-wrap:anywhere]">
                  {p.name} {p.botanicalName && <span className="italic text-stone-700">({p.botanicalName})</span>}
                </p>
                {p.ok ? (
                  <p className="text-moss-800">{actionText[p.action!]}</p>
                ) : (
                  <>
                    <p className="text-clay-700">{p.message}</p>
                    <ul className="mt-2 list-disc pl-5 text-sm">
                      {Object.entries(p.fields ?? {}).map(([field, msgs]) => (
                        <li key={field} className="[overflow-wrap:anywhere]" data-field={field}>
                          {msgs.map((m) => (
                            <span key={m} className="block">
                              {m}
                            </span>
                          ))}
                        </li>
                      ))}
                    </ul>
                  </>
                )}
              </li>
            ))}
          </ul>
          {done ? null : writable === 0 ? (
            <p role="status" className={bad > 0 ? 'text-clay-700' : ''}>
              {bad > 0
                ? `Fix the ${bad} file(s) with errors and choose them again; no file here can be imported yet.`
                : 'Every file matches what is already in the knowledge base.'}
            </p>
          ) : (
            <div className="card space-y-3">
              {bad > 0 && (
                <p className="text-clay-700" data-testid="import-partial">
                  {bad} file(s) have errors and will be left out. The other {writable} can be imported now; fix the rest and choose them again later.
                </p>
              )}
              <div>
                <label htmlFor="import-summary" className="field-label">
                  Edit summary
                </label>
                <input id="import-summary" className="field-input" value={summary} onChange={(e) => setSummary(e.target.value)} placeholder="Imported from …" />
              </div>
              <label className="flex min-h-target items-center gap-2">
                <input type="checkbox" className="h-5 w-5" checked={publish} onChange={(e) => setPublish(e.target.checked)} />
                Publish at once (otherwise saved as drafts for review)
              </label>
              <button type="button" className="btn-primary" disabled={busy} onClick={() => void commit()}>
                {bad > 0 ? `Import the ${writable} valid file(s)` : `Import ${writable} file(s)`}
              </button>
            </div>
          )}
        </section>
      )}
    </div>
  );
}
