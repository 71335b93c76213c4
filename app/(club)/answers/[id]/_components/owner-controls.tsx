'use client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { sendJson, ApiError } from '@/components/fetcher';
import { useOnline } from '@/components/offline/offline-banner';

type State = { note: string; followUp: string; visibility: 'private' | 'club'; treeId: string | null };

export function OwnerControls({ id, initial, trees }: { id: string; initial: State; trees: { id: string; name: string }[] }) {
  const router = useRouter();
  const [v, setV] = useState(initial);
  const [status, setStatus] = useState<{ kind: 'idle' | 'saving' | 'saved' | 'error'; message?: string }>({ kind: 'idle' });
  const [confirmDelete, setConfirmDelete] = useState(false);
  const online = useOnline();

  async function save(e: React.FormEvent) {
    e.preventDefault();
    setStatus({ kind: 'saving' });
    try {
      await sendJson(`/api/answers/${id}`, 'PATCH', v);
      setStatus({ kind: 'saved' });
      router.refresh();
    } catch (err) {
      setStatus({ kind: 'error', message: err instanceof ApiError ? err.message : 'Could not save.' });
    }
  }
  async function remove() {
    try {
      await sendJson(`/api/answers/${id}`, 'DELETE');
      router.push('/answers');
    } catch (err) {
      setStatus({ kind: 'error', message: err instanceof ApiError ? err.message : 'Could not delete.' });
    }
  }

  return (
    <form onSubmit={save} className="card space-y-3" aria-labelledby="follow-h">
      <h2 id="follow-h" className="text-lg">
        Follow-up
      </h2>
      <div>
        <label htmlFor="follow-up" className="field-label">
          What happened since
        </label>
        <textarea
          id="follow-up"
          className="field-input"
          rows={3}
          maxLength={4000}
          value={v.followUp}
          onChange={(e) => setV({ ...v, followUp: e.target.value })}
          placeholder="e.g. pinched on 12 May; second elongation by 1 June"
        />
      </div>
      <div>
        <label htmlFor="note" className="field-label">
          Note
        </label>
        <textarea id="note" className="field-input" rows={2} maxLength={2000} value={v.note} onChange={(e) => setV({ ...v, note: e.target.value })} />
      </div>
      <div>
        <label htmlFor="visibility" className="field-label">
          Who can see it
        </label>
        <select
          id="visibility"
          className="field-input"
          value={v.visibility}
          onChange={(e) => setV({ ...v, visibility: e.target.value as State['visibility'] })}
        >
          <option value="private">Only me</option>
          <option value="club">Shared with the club</option>
        </select>
      </div>
      {trees.length > 0 && (
        <div>
          <label htmlFor="answer-tree" className="field-label">
            Which of your trees
          </label>
          <select id="answer-tree" className="field-input" value={v.treeId ?? ''} onChange={(e) => setV({ ...v, treeId: e.target.value || null })}>
            <option value="">Not one of mine</option>
            {trees.map((t) => (
              <option key={t.id} value={t.id}>
                {t.name}
              </option>
            ))}
          </select>
        </div>
      )}
      <div className="flex flex-wrap gap-3">
        <button type="submit" className="btn-primary" disabled={status.kind === 'saving' || !online} aria-describedby={online ? undefined : 'owner-offline'}>
          {status.kind === 'saving' ? 'Saving…' : 'Save changes'}
        </button>
        {!confirmDelete ? (
          <button type="button" className="btn-secondary" disabled={!online} onClick={() => setConfirmDelete(true)}>
            Delete…
          </button>
        ) : (
          <button type="button" className="btn-danger" disabled={!online} onClick={remove}>
            Yes, delete this answer
          </button>
        )}
      </div>
      {!online && (
        <p id="owner-offline" className="text-stone-700" data-testid="owner-offline">
          Changing the note, the follow-up or who can see it needs a connection.
        </p>
      )}
      <p aria-live="polite" className={status.kind === 'error' ? 'field-error' : 'text-moss-700'}>
        {status.kind === 'saved' ? 'Saved.' : status.kind === 'error' ? status.message : ''}
      </p>
    </form>
  );
}
