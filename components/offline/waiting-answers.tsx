'use client';
import { useState } from 'react';
import { useOnline } from './offline-banner';
import { discardQueued, flushQueue, retryQueued } from './queue';
import { currentMemberId } from './member';
import { useQueued } from './use-queue';

/** Answers saved on this phone that the server does not have yet, oldest first. Nothing when there are none. */
export function WaitingAnswers({ heading = 'h2' }: { heading?: 'h2' | 'h3' }) {
  const items = useQueued();
  const online = useOnline();
  const [busy, setBusy] = useState(false);
  if (!items || items.length === 0) return null;
  const H = heading;
  const waiting = items.filter((e) => !e.refused).length;
  const sendNow = async () => {
    const userId = currentMemberId();
    if (!userId) return;
    setBusy(true);
    try {
      await flushQueue(userId);
    } finally {
      setBusy(false);
    }
  };
  return (
    <section id="waiting-to-send" className="card border-sun-500 bg-sun-100" aria-labelledby="waiting-h" data-testid="waiting-answers">
      <H id="waiting-h" className="text-lg">
        Waiting to send: <span data-testid="waiting-count">{waiting}</span> {waiting === 1 ? 'answer' : 'answers'}
      </H>
      <p className="text-stone-800">
        {online ? 'Sending them now, oldest first.' : 'Kept on this phone. They are sent by themselves, oldest first, when the connection returns.'}
      </p>
      <ul className="mt-2 space-y-2">
        {items.map((e) => (
          <li key={e.key} className="rounded-lg bg-white p-2" data-testid="waiting-item">
            <span className="block font-medium">
              {e.label.speciesName}, {e.label.date}
            </span>
            {e.label.headline && <span className="block text-stone-700">{e.label.headline}</span>}
            {e.refused ? (
              <span className="mt-1 block">
                <span className="block text-clay-700" role="alert">
                  Not accepted: {e.refused}
                </span>
                <span className="mt-1 flex flex-wrap gap-2">
                  <button type="button" className="btn-secondary" onClick={() => void retryQueued(e.key, e.userId)}>
                    Try again
                  </button>
                  <button type="button" className="btn-secondary" onClick={() => void discardQueued(e.key, e.userId)}>
                    Remove from this phone
                  </button>
                </span>
              </span>
            ) : (
              <span className="block text-sm text-stone-700">
                Waiting to send{e.attempts > 0 ? ` (tried ${e.attempts} ${e.attempts === 1 ? 'time' : 'times'})` : ''}
              </span>
            )}
          </li>
        ))}
      </ul>
      {online && waiting > 0 && (
        <button type="button" className="btn-secondary mt-3" disabled={busy} onClick={() => void sendNow()}>
          {busy ? 'Sending…' : 'Send now'}
        </button>
      )}
    </section>
  );
}
