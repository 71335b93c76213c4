'use client';
import { useState } from 'react';
import useSWR from 'swr';
import { ApiError, fetcher, sendJson } from '@/components/fetcher';
import type { ReminderRunDto } from '@/lib/data/reminders';

function Progress({ run }: { run: ReminderRunDto }) {
  const done = run.sent + run.skipped + run.failed;
  return (
    <div className="space-y-2" data-testid="reminder-run" data-run-id={run.id} data-finished={run.finished ? 'yes' : 'no'}>
      <p>
        <span className="font-semibold">Week of {run.weekOf}</span>
        {' · '}
        {run.total === null ? 'listing members…' : run.finished ? 'finished' : `${done} of ${run.total} members done`}
      </p>
      {run.total ? (
        <progress className="h-3 w-full" max={run.total} value={done} aria-label={`Week of ${run.weekOf}: ${done} of ${run.total} members done`} />
      ) : null}
      <p className="text-sm text-stone-700">
        <span data-testid="run-sent">{run.sent} sent</span>
        {' · '}
        <span data-testid="run-skipped">{run.skipped} skipped (nothing due, or already reminded that week)</span>
        {run.failed ? (
          <>
            {' · '}
            <span className="field-error" data-testid="run-failed">
              {run.failed} failed
            </span>
          </>
        ) : null}
      </p>
    </div>
  );
}

/** Start the weekly reminders and watch the run; SWR polls while a run is unfinished. */
export function ReminderRuns({ initial, thisMonday }: { initial: ReminderRunDto[]; thisMonday: string }) {
  const [weekOf, setWeekOf] = useState(thisMonday);
  const [error, setError] = useState('');
  const [busy, setBusy] = useState(false);
  const { data, mutate } = useSWR<{ items: ReminderRunDto[] }>('/api/admin/reminders/runs', fetcher, {
    fallbackData: { items: initial },
    refreshInterval: (latest) => (latest?.items.some((r) => !r.finished) ? 1000 : 0),
  });
  async function start() {
    setBusy(true);
    setError('');
    try {
      await sendJson('/api/admin/reminders/run', 'POST', { weekOf });
      await mutate();
    } catch (e) {
      setError(e instanceof ApiError ? (e.body.fields?.weekOf?.[0] ?? e.message) : (e as Error).message);
    } finally {
      setBusy(false);
    }
  }
  const runs = data?.items ?? [];
  return (
    <div className="card space-y-4" data-testid="reminder-runs">
      <div className="flex flex-wrap items-end gap-3">
        <div>
          <label htmlFor="week-of" className="field-label">
            Week of
          </label>
          <input
            id="week-of"
            type="date"
            className="field-input"
            value={weekOf}
            onChange={(e) => setWeekOf(e.target.value)}
            aria-describedby={error ? 'week-of-error' : undefined}
          />
        </div>
        <button type="button" className="btn-primary" onClick={() => void start()} disabled={busy} data-testid="start-reminders">
          Send the week’s reminders
        </button>
      </div>
      {error ? (
        <p id="week-of-error" role="alert" className="field-error">
          {error}
        </p>
      ) : null}
      <div aria-live="polite" className="space-y-4">
        {runs.length === 0 ? <p className="text-stone-700">No reminders sent yet.</p> : runs.map((r) => <Progress key={r.id} run={r} />)}
      </div>
    </div>
  );
}
