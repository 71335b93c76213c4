'use client';
import { useState } from 'react';
import Link from 'next/link';

export function SaveAnswer({
  signedIn, saving, saved, error, onSave,
}: {
  signedIn: boolean;
  saving: boolean;
  saved: { id: string; url: string } | null;
  error: string | null;
  onSave: (note: string | undefined, visibility: 'private' | 'club') => void;
}) {
  const [note, setNote] = useState('');
  const [visibility, setVisibility] = useState<'private' | 'club'>('private');
  if (!signedIn) {
    return (
      <section className="card">
        <p className="text-lg">Want to keep this answer and add what happened later?</p>
        <Link className="btn-primary mt-3" href={`/sign-in?callbackUrl=${encodeURIComponent('/ask?step=answer')}`}>Sign in to save it</Link>
      </section>
    );
  }
  if (saved) {
    return (
      <section className="card border-moss-300 bg-moss-50" role="status" data-testid="saved" tabIndex={-1}>
        <p className="text-lg font-semibold">Saved to your answers.</p>
        <Link className="btn-primary mt-3" href={saved.url}>Open the saved answer</Link>
      </section>
    );
  }
  return (
    <form
      className="card space-y-3"
      onSubmit={(e) => {
        e.preventDefault();
        onSave(note.trim() || undefined, visibility);
      }}
    >
      <h3 className="text-lg">Save this answer</h3>
      <details>
        <summary className="min-h-target cursor-pointer py-2.5 font-medium text-moss-700">Add a note or share with the club</summary>
      <div>
        <label htmlFor="save-note" className="field-label">Note (optional)</label>
        <textarea id="save-note" className="field-input" rows={2} maxLength={2000} value={note} onChange={(e) => setNote(e.target.value)} placeholder="e.g. the long shoot on the south side" />
      </div>
      <div>
        <label htmlFor="save-visibility" className="field-label">Who can see it</label>
        <select id="save-visibility" className="field-input" value={visibility} onChange={(e) => setVisibility(e.target.value as 'private' | 'club')}>
          <option value="private">Only me</option>
          <option value="club">Shared with the club</option>
        </select>
      </div>
      </details>
      {error && <p role="alert" className="field-error" tabIndex={-1}>{error}</p>}
      <button type="submit" className="btn-primary w-full text-lg" disabled={saving}>{saving ? 'Saving…' : 'Save answer'}</button>
    </form>
  );
}
