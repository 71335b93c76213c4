import 'server-only';
import { claimJob, completeJob, failJob, releaseOrphanedJobs, type Job } from '@/lib/data/jobs';
import { getDbHandle } from '@/db/client';
import { DIGEST_MEMBER_QUEUE, handleDigestMemberJob } from '@/lib/data/digests';
import { handleMemberJob, handleRunJob, onMemberJobFailed, REMINDER_MEMBER_QUEUE, REMINDER_RUN_QUEUE } from '@/lib/data/reminders';

// The queue's worker (meeting-note digests, weekly reminders), running inside the server process: one job at a time (a small club's mail
// does not need more, and PGlite is one connection anyway). It polls for due jobs, and wakes at
// once when this process queues one.
//
// Several processes on one PostgreSQL each run this worker; that is safe because the worker only
// claims (FOR UPDATE SKIP LOCKED, one holder per job) and schedules nothing itself. Jobs are
// queued by requests (a reminder run an administrator starts, a published note's digest) with a
// dedupe key per piece of work, and a reminder reaches a member once a week by reminder_sends'
// unique (week, member) row, whichever process works the job or works it again after a crash.

interface Handler {
  run(job: Job): Promise<void>;
  /** Called once when the last attempt failed. */
  failed?(job: Job, error: string): Promise<void>;
}

const handlers: Record<string, Handler> = {
  [REMINDER_RUN_QUEUE]: { run: handleRunJob },
  [REMINDER_MEMBER_QUEUE]: { run: handleMemberJob, failed: onMemberJobFailed },
  [DIGEST_MEMBER_QUEUE]: { run: handleDigestMemberJob },
};

export interface WorkerOptions {
  pollMs?: number;
  leaseMs?: number;
  backoffBaseMs?: number;
}

interface WorkerState {
  running: boolean;
  wake: (() => void) | null;
  loop: Promise<void> | null;
}

const g = globalThis as unknown as { __cwWorker?: WorkerState };

/** Run one due job, if there is one. True when a job ran (whatever its outcome). */
export async function runOneJob(opts: WorkerOptions = {}): Promise<boolean> {
  const job = await claimJob(Object.keys(handlers), opts.leaseMs ?? 60_000);
  if (!job) return false;
  const handler = handlers[job.queue];
  try {
    await handler.run(job);
    await completeJob(job.id);
  } catch (e) {
    const message = e instanceof Error ? e.message : String(e);
    console.error(`[candlewise] job ${job.queue} #${job.id} attempt ${job.attempts} failed: ${message}`);
    const outcome = await failJob(job, message, opts.backoffBaseMs);
    if (outcome === 'failed') await handler.failed?.(job, message).catch(() => {});
  }
  return true;
}

/** Start the process's worker (once). */
export async function startWorker(opts: WorkerOptions = {}) {
  if (g.__cwWorker?.running) return;
  const state: WorkerState = { running: true, wake: null, loop: null };
  g.__cwWorker = state;
  const handle = await getDbHandle();
  // PGlite: this process holds the directory alone, so an active job now is a dead process's.
  if (handle.kind === 'pglite') await releaseOrphanedJobs();
  const pollMs = opts.pollMs ?? 1000;
  state.loop = (async () => {
    while (state.running) {
      let ran = false;
      try {
        ran = await runOneJob(opts);
      } catch (e) {
        console.error('[candlewise] job queue', e instanceof Error ? e.message : e);
      }
      if (ran) continue;
      await new Promise<void>((resolve) => {
        const t = setTimeout(resolve, pollMs);
        state.wake = () => {
          clearTimeout(t);
          resolve();
        };
      });
      state.wake = null;
    }
  })();
}
