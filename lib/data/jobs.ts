import 'server-only';
import { and, eq, inArray, lt, lte, or, sql } from 'drizzle-orm';
import { getDb, type Db } from '@/db/client';
import { jobs } from '@/db/schema';

// The job queue's storage: a plain table, claimed with FOR UPDATE SKIP LOCKED through Drizzle.
//
// Why not pg-boss: it is the well-known package for this, but it talks to the database through the
// `pg` driver and its own connection pool, and it sends multi-statement SQL (advisory locks inside
// BEGIN … COMMIT strings). PGlite, the embedded default, is one in-process connection with no
// network port: pg-boss would need either @electric-sql/pglite-socket (a TCP server in the same
// process that the whole pool would then queue behind, one connection at a time) or a custom
// executor that splits its SQL between PGlite's `query` and `exec`. Either way the queue would no
// longer share the app's transactions, and a job's bookkeeping could not commit together with the
// work it did. This table does what the reminders need — durable jobs, a lease so a job whose
// worker died is picked up again, retries with exponential backoff, a dedupe key — with the
// same Drizzle client on PGlite and on PostgreSQL (SKIP LOCKED lets several server processes share
// one PostgreSQL database; on PGlite there is only ever one process).

export interface Job {
  id: number;
  queue: string;
  payload: Record<string, unknown>;
  attempts: number;
  maxAttempts: number;
}

export interface EnqueueOptions {
  /** A second job with the same key is not added (the first one's id is returned). */
  dedupeKey?: string;
  maxAttempts?: number;
  runAt?: Date;
}

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/** Add a job (inside `tx` when given, so it commits with the caller's own writes). */
export async function enqueue(queue: string, payload: Record<string, unknown>, opts: EnqueueOptions = {}, tx?: Tx): Promise<number> {
  const db = tx ?? (await getDb());
  const [row] = await db
    .insert(jobs)
    .values({ queue, payload, dedupeKey: opts.dedupeKey ?? null, maxAttempts: opts.maxAttempts ?? 5, runAt: opts.runAt ?? new Date() })
    .onConflictDoNothing({ target: jobs.dedupeKey })
    .returning({ id: jobs.id });
  if (row) return row.id;
  const [existing] = await db.select({ id: jobs.id }).from(jobs).where(eq(jobs.dedupeKey, opts.dedupeKey!)).limit(1);
  return existing.id;
}

/**
 * Claim the oldest due job of `queues`: a queued job whose time has come, or an active one whose
 * lease ran out (its worker stopped without finishing). Null when there is none.
 */
export async function claimJob(queues: string[], leaseMs: number): Promise<Job | null> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const now = new Date();
    const [due] = await tx
      .select({ id: jobs.id })
      .from(jobs)
      .where(
        and(inArray(jobs.queue, queues), or(and(eq(jobs.state, 'queued'), lte(jobs.runAt, now)), and(eq(jobs.state, 'active'), lt(jobs.lockedUntil, now)))),
      )
      .orderBy(jobs.runAt, jobs.id)
      .limit(1)
      .for('update', { skipLocked: true });
    if (!due) return null;
    const [job] = await tx
      .update(jobs)
      .set({ state: 'active', attempts: sql`${jobs.attempts} + 1`, lockedUntil: new Date(now.getTime() + leaseMs) })
      .where(eq(jobs.id, due.id))
      .returning({ id: jobs.id, queue: jobs.queue, payload: jobs.payload, attempts: jobs.attempts, maxAttempts: jobs.maxAttempts });
    return job;
  });
}

export async function completeJob(id: number) {
  const db = await getDb();
  await db.update(jobs).set({ state: 'done', lockedUntil: null, finishedAt: new Date() }).where(eq(jobs.id, id));
}

/** Delay before attempt `attempts + 1`: 2 s, 4 s, 8 s … capped at 10 minutes. */
export function backoffMs(attempts: number, baseMs = 2000): number {
  return Math.min(baseMs * 2 ** Math.max(0, attempts - 1), 10 * 60_000);
}

/** A failed attempt: queued again after the backoff, or failed for good after the last attempt. */
export async function failJob(job: Pick<Job, 'id' | 'attempts' | 'maxAttempts'>, error: string, baseMs?: number): Promise<'retry' | 'failed'> {
  const db = await getDb();
  const last = job.attempts >= job.maxAttempts;
  await db
    .update(jobs)
    .set(
      last
        ? { state: 'failed', lockedUntil: null, lastError: error.slice(0, 500), finishedAt: new Date() }
        : { state: 'queued', lockedUntil: null, lastError: error.slice(0, 500), runAt: new Date(Date.now() + backoffMs(job.attempts, baseMs)) },
    )
    .where(eq(jobs.id, job.id));
  return last ? 'failed' : 'retry';
}

/**
 * On PGlite the process holds the data directory alone (db/lock.ts), so an active job at start
 * was left by a process that died: make it due now instead of waiting for its lease.
 */
export async function releaseOrphanedJobs(): Promise<number> {
  const db = await getDb();
  const rows = await db.update(jobs).set({ state: 'queued', lockedUntil: null, runAt: new Date() }).where(eq(jobs.state, 'active')).returning({ id: jobs.id });
  return rows.length;
}

export async function jobState(id: number) {
  const db = await getDb();
  const [row] = await db
    .select({ state: jobs.state, attempts: jobs.attempts, lastError: jobs.lastError, runAt: jobs.runAt })
    .from(jobs)
    .where(eq(jobs.id, id))
    .limit(1);
  return row ?? null;
}

/** A job was queued in this process: the worker (lib/queue/worker.ts) looks now, not at its next poll. */
export function notifyQueued() {
  (globalThis as unknown as { __cwWorker?: { wake: (() => void) | null } }).__cwWorker?.wake?.();
}
