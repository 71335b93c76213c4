'use client';
import { useState } from 'react';
import Link from 'next/link';
import { isWaiting } from '@/components/offline/evaluate-anywhere';
import { useOnline } from '@/components/offline/offline-banner';
import { useSent } from '@/components/offline/use-queue';
import { WaitingAnswers } from '@/components/offline/waiting-answers';

/** A save that went into the phone's queue: waiting until it is sent, then a link like any other. */
function QueuedSave({ queueKey }: { queueKey: string }) {
  const sent = useSent(queueKey);
  if (sent) {
    return (
      <section className="card border-moss-300 bg-moss-50" role="status" data-testid="saved">
        <p className="text-lg font-semibold">Sent and saved to your answers.</p>
        <Link className="btn-primary mt-3" href={sent.url}>
          Open the saved answer
        </Link>
      </section>
    );
  }
  return (
    <div className="space-y-3">
      <section className="card border-sun-500" role="status" data-testid="saved-waiting">
        <p className="text-lg font-semibold">Kept on this phone: waiting to send.</p>
        <p className="text-stone-700">It is sent by itself when the connection returns, and then appears in your answers.</p>
      </section>
      <WaitingAnswers heading="h3" />
    </div>
  );
}

export function SaveAnswer({
  signedIn,
  saving,
  saved,
  error,
  onSave,
}: {
  signedIn: boolean;
  saving: boolean;
  saved: { id: string; url: string } | null;
  error: string | null;
  onSave: (note: string | undefined, visibility: 'private' | 'club') => void;
}) {
  const [note, setNote] = useState('');
  const [visibility, setVisibility] = useState<'private' | 'club'>('private');
  const online = useOnline();
  if (!signedIn) {
    return (
      <section className="card">
        <p className="text-lg">Want to keep this answer and add what happened later?</p>
        <Link className="btn-primary mt-3" href={`/sign-in?callbackUrl=${encodeURIComponent('/ask?step=answer')}`}>
          Sign in to save it
        </Link>
      </section>
    );
  }
  if (saved && isWaiting(saved)) return <QueuedSave queueKey={saved.id} />;
  if (saved) {
    return (
      <section className="card border-moss-300 bg-moss-50" role="status" data-testid="saved" tabIndex={-1}>
        <p className="text-lg font-semibold">Saved to your answers.</p>
        <Link className="btn-primary mt-3" href={saved.url}>
          Open the saved answer
        </Link>
      </section>
    );
  }
  return (
    <form
      className="card space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        onSave(note.trim() || undefined, online ? visibility : 'private');
      }}
    >
      <h3 className="text-lg">Save this answer</h3>
      <details>
        <summary className="min-h-target cursor-pointer py-2.5 font-medium text-moss-700">Add a note or share with the club</summary>
        <div>
          <label htmlFor="save-note" className="field-label">
            Note (optional)
          </label>
          <textarea
            id="save-note"
            className="field-input"
            rows={2}
            maxLength={2000}
            value={note}
            onChange={(e) => setNote(e.target.value)}
            placeholder="e.g. the long shoot on the south side"
          />
        </div>
        <div>
          <label htmlFor="save-visibility" className="field-label">
            Who can see it
          </label>
          <select
            id="save-visibility"
            className="field-input"
            value={online ? visibility : 'private'}
            disabled={!online}
            aria-describedby={online ? undefined : 'save-visibility-why'}
            onChange={(e) => setVisibility(e.target.value as 'private' | 'club')}
          >
            <option value="private">Only me</option>
            <option value="club">Shared with the club</option>
          </select>
          {!online && (
            <p id="save-visibility-why" className="mt-1 text-sm text-stone-700">
              Sharing needs a connection. Saved now, it is kept for you only; share it from the answer once it is sent.
            </p>
          )}
        </div>
      </details>
      {!online && (
        <p className="text-stone-700" data-testid="save-offline-hint">
          No connection: the answer waits on this phone and is sent when you are back online.
        </p>
      )}
      {error && (
        <p role="alert" className="field-error" tabIndex={-1}>
          {error}
        </p>
      )}
      <button type="submit" className="btn-primary w-full text-lg" disabled={saving}>
        {saving ? 'Saving…' : online ? 'Save answer' : 'Save on this phone'}
      </button>
    </form>
  );
}
