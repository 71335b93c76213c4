'use client';
import { useState } from 'react';
import useSWR from 'swr';
import { ApiError, fetcher, sendJson } from '@/components/fetcher';
import type { DigestSendDto } from '@/lib/data/digests';

type Status = { sends: DigestSendDto[]; optedIn: number; published: boolean };
const when = (iso: string) => `${iso.slice(0, 10)} at ${iso.slice(11, 16)} UTC`;

/** Send a published note to the members who opted in; a repeat asks first. */
export function SendDigest({ slug, published }: { slug: string; published: boolean }) {
  const key = `/api/notes/${slug}/send`;
  const { data, mutate } = useSWR<Status>(key, fetcher);
  const [busy, setBusy] = useState(false);
  const [confirming, setConfirming] = useState<DigestSendDto | null>(null);
  const [message, setMessage] = useState<string | null>(null);

  async function send(confirm: boolean) {
    setBusy(true);
    setMessage(null);
    try {
      const res = await sendJson<{ recipients: number; failed: number }>(key, 'POST', confirm ? { confirm: true } : {});
      setConfirming(null);
      setMessage(`Sent to ${res.recipients} member${res.recipients === 1 ? '' : 's'}.${res.failed ? ` ${res.failed} could not be delivered.` : ''}`);
      await mutate();
    } catch (e) {
      if (e instanceof ApiError && e.status === 409 && e.body.code === 'conflict:digest_already_sent') {
        const prev = (e.body as unknown as { previous?: DigestSendDto }).previous;
        setConfirming(prev ?? { sentAt: new Date().toISOString(), recipients: 0, senderName: 'a librarian' });
      } else {
        setMessage((e as Error).message);
      }
    } finally {
      setBusy(false);
    }
  }

  return (
    <section aria-labelledby="digest-heading" className="card space-y-3" data-testid="send-digest">
      <h2 id="digest-heading" className="text-xl">E-mail to members</h2>
      {!published ? (
        <p className="text-stone-700">Publish the note first; then you can e-mail it to the members who asked for meeting notes.</p>
      ) : (
        <>
          <p className="text-stone-700">
            {data ? `${data.optedIn} member${data.optedIn === 1 ? '' : 's'} asked for meeting notes by e-mail.` : 'Counting members who asked for meeting notes…'}
            {' '}Each message has its own link to stop them.
          </p>
          {confirming ? (
            <div role="alertdialog" aria-labelledby="resend-q" className="space-y-3 rounded-lg border border-sun-500 bg-sun-100 p-3">
              <p id="resend-q">
                This note already went out on {when(confirming.sentAt)} to {confirming.recipients} member{confirming.recipients === 1 ? '' : 's'} ({confirming.senderName}). Send it again?
              </p>
              <div className="flex flex-wrap gap-3">
                <button type="button" className="btn-primary" disabled={busy} onClick={() => void send(true)}>Yes, send again</button>
                <button type="button" className="btn-secondary" disabled={busy} onClick={() => setConfirming(null)}>Cancel</button>
              </div>
            </div>
          ) : (
            <button type="button" className="btn-primary" disabled={busy} onClick={() => void send(false)}>{busy ? 'Sending…' : 'Send to members'}</button>
          )}
        </>
      )}
      <p role="status" className="text-moss-800">{message}</p>
      {data && data.sends.length > 0 ? (
        <div>
          <h3 className="text-base font-semibold">Sent before</h3>
          <ul className="list-disc pl-5 text-sm" data-testid="digest-sends">
            {data.sends.map((s) => <li key={s.sentAt}>{when(s.sentAt)}: {s.recipients} member{s.recipients === 1 ? '' : 's'}, by {s.senderName}</li>)}
          </ul>
        </div>
      ) : null}
    </section>
  );
}
