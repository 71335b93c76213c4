'use client';
import { useEffect, useRef, useState } from 'react';
import useSWR from 'swr';
import { ApiError, fetcher, sendJson } from '@/components/fetcher';
import type { DigestPreviewDto, DigestSendDto } from '@/lib/data/digests';

type Status = { sends: DigestSendDto[]; optedIn: number; published: boolean };
const when = (iso: string) => `${iso.slice(0, 10)} at ${iso.slice(11, 16)} UTC`;

/** Send a published note to the members who opted in; a repeat asks first. */
export function SendDigest({ slug, published }: { slug: string; published: boolean }) {
  const key = `/api/notes/${slug}/send`;
  const { data, mutate } = useSWR<Status>(key, fetcher);
  const [busy, setBusy] = useState(false);
  const [confirming, setConfirming] = useState<DigestSendDto | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [preview, setPreview] = useState<DigestPreviewDto | null>(null);
  const [view, setView] = useState<'html' | 'text'>('html');
  const previewRef = useRef<HTMLHeadingElement>(null);
  const confirmRef = useRef<HTMLButtonElement>(null);
  const statusRef = useRef<HTMLParagraphElement>(null);
  const startRef = useRef<HTMLButtonElement>(null);
  const [focusNext, setFocusNext] = useState<'preview' | 'confirm' | 'status' | 'start' | null>(null);
  // After each step, the focus goes to what comes next: the preview, the resend question, the result.
  useEffect(() => {
    if (!focusNext) return;
    ({ preview: previewRef, confirm: confirmRef, status: statusRef, start: startRef })[focusNext].current?.focus();
    setFocusNext(null);
  }, [focusNext, preview, confirming, message]);

  async function openPreview() {
    setBusy(true);
    setMessage(null);
    try {
      setPreview(await fetcher<DigestPreviewDto>(`${key}?preview=1`));
      setFocusNext('preview');
    } catch (e) {
      setMessage((e as Error).message);
      setFocusNext('status');
    } finally {
      setBusy(false);
    }
  }

  async function send(confirm: boolean) {
    setBusy(true);
    setMessage(null);
    try {
      const res = await sendJson<{ recipients: number; failed: number }>(key, 'POST', confirm ? { confirm: true } : {});
      setConfirming(null);
      setPreview(null);
      setFocusNext('status');
      setMessage(`Sent to ${res.recipients} member${res.recipients === 1 ? '' : 's'}.${res.failed ? ` ${res.failed} could not be delivered.` : ''}`);
      await mutate();
    } catch (e) {
      if (e instanceof ApiError && e.status === 409 && e.body.code === 'conflict:digest_already_sent') {
        const prev = (e.body as unknown as { previous?: DigestSendDto }).previous;
        setConfirming(prev ?? { sentAt: new Date().toISOString(), recipients: 0, senderName: 'a librarian' });
        setFocusNext('confirm');
      } else {
        setMessage((e as Error).message);
        setFocusNext('status');
      }
    } finally {
      setBusy(false);
    }
  }

  return (
    <section aria-labelledby="digest-heading" className="card space-y-3" data-testid="send-digest">
      <h2 id="digest-heading" className="text-xl">
        E-mail to members
      </h2>
      {!published ? (
        <p className="text-stone-700">Publish the note first; then you can e-mail it to the members who asked for meeting notes.</p>
      ) : (
        <>
          <p className="text-stone-700">
            {data
              ? `${data.optedIn} member${data.optedIn === 1 ? '' : 's'} asked for meeting notes by e-mail.`
              : 'Counting members who asked for meeting notes…'}{' '}
            Each message has its own link to stop them.
          </p>
          {confirming ? (
            <div role="alertdialog" aria-labelledby="resend-q" className="space-y-3 rounded-lg border border-sun-500 bg-sun-100 p-3">
              <p id="resend-q">
                This note already went out on {when(confirming.sentAt)} to {confirming.recipients} member{confirming.recipients === 1 ? '' : 's'} (
                {confirming.senderName}). Send it again?
              </p>
              <div className="flex flex-wrap gap-3">
                <button ref={confirmRef} type="button" className="btn-primary" disabled={busy} onClick={() => void send(true)}>
                  Yes, send again
                </button>
                <button
                  type="button"
                  className="btn-secondary"
                  disabled={busy}
                  onClick={() => {
                    setConfirming(null);
                    setPreview(null);
                    setFocusNext('start');
                  }}
                >
                  Cancel
                </button>
              </div>
            </div>
          ) : preview ? (
            <div className="space-y-3 rounded-lg border border-stone-300 bg-stone-50 p-3" data-testid="digest-preview">
              <h3 ref={previewRef} tabIndex={-1} className="text-lg">
                Check the e-mail before it goes out
              </h3>
              <p data-testid="digest-recipients">
                It goes to{' '}
                <strong>
                  {preview.recipients} member{preview.recipients === 1 ? '' : 's'}
                </strong>
                , one message each with their own link to stop them.
              </p>
              <p className="break-words text-sm">
                <span className="font-medium">Subject:</span> {preview.subject}
              </p>
              <div role="group" aria-label="Which part to show" className="flex flex-wrap gap-2">
                <button
                  type="button"
                  className={view === 'html' ? 'btn-primary' : 'btn-secondary'}
                  aria-pressed={view === 'html'}
                  onClick={() => setView('html')}
                >
                  As formatted (HTML)
                </button>
                <button
                  type="button"
                  className={view === 'text' ? 'btn-primary' : 'btn-secondary'}
                  aria-pressed={view === 'text'}
                  onClick={() => setView('text')}
                >
                  As plain text
                </button>
              </div>
              {view === 'html' ? (
                // Sandboxed: no scripts, no same-origin access; the mail's own links open outside.
                <iframe
                  title="The e-mail as formatted (HTML part)"
                  sandbox="allow-popups allow-popups-to-escape-sandbox"
                  srcDoc={preview.html}
                  className="h-[28rem] w-full rounded border border-stone-300 bg-white"
                  data-testid="digest-preview-html"
                />
              ) : (
                <pre
                  className="max-h-[28rem] overflow-auto whitespace-pre-wrap break-words rounded border border-stone-300 bg-white p-3 font-sans text-sm"
                  data-testid="digest-preview-text"
                >
                  {preview.text}
                </pre>
              )}
              <div className="flex flex-wrap gap-3">
                <button type="button" className="btn-primary" disabled={busy} onClick={() => void send(false)}>
                  {busy ? 'Sending…' : `Send to ${preview.recipients} member${preview.recipients === 1 ? '' : 's'}`}
                </button>
                <button
                  type="button"
                  className="btn-secondary"
                  disabled={busy}
                  onClick={() => {
                    setPreview(null);
                    setFocusNext('start');
                  }}
                >
                  Not now
                </button>
              </div>
            </div>
          ) : (
            <button ref={startRef} type="button" className="btn-primary" disabled={busy} onClick={() => void openPreview()}>
              {busy ? 'Preparing the preview…' : 'Send to members'}
            </button>
          )}
        </>
      )}
      <p ref={statusRef} tabIndex={-1} role="status" className="text-moss-800">
        {message}
      </p>
      {data && data.sends.length > 0 ? (
        <div>
          <h3 className="text-base font-semibold">Sent before</h3>
          <ul className="list-disc pl-5 text-sm" data-testid="digest-sends">
            {data.sends.map((s) => (
              <li key={s.sentAt}>
                {when(s.sentAt)}: {s.recipients} member{s.recipients === 1 ? '' : 's'}, by {s.senderName}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </section>
  );
}
