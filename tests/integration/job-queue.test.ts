import { afterAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { openDatabase, type DbHandle } from '@/db/open';
import { setDbHandle } from '@/db/client';
import { jobs } from '@/db/schema';
import { claimJob, completeJob, enqueue } from '@/lib/data/jobs';

// The job queue's claim on the database the suite runs on: in the PostgreSQL pass
// (scripts/with-postgres.sh sets TEST_DATABASE_URL) a new database on that server with a pool of
// ten connections, so the claimers really race and FOR UPDATE SKIP LOCKED is what keeps them
// apart; in the PGlite pass an in-memory PGlite (one connection, the claims take turns).
const serverUrl = process.env.TEST_DATABASE_URL;
const cleanups: (() => Promise<void>)[] = [];
afterAll(async () => {
  for (const c of cleanups.reverse()) await c();
});

async function open(): Promise<DbHandle> {
  if (!serverUrl) return openDatabase({ pgliteDir: 'memory' });
  const { default: postgres } = await import('postgres');
  const admin = postgres(serverUrl, { max: 1, onnotice: () => {} });
  const name = `cw_queue_${process.pid}_${Date.now()}`;
  await admin.unsafe(`create database ${name}`);
  cleanups.push(async () => {
    await admin.unsafe(`drop database if exists ${name} with (force)`);
    await admin.end({ timeout: 5 });
  });
  const u = new URL(serverUrl);
  u.pathname = `/${name}`;
  return openDatabase({ databaseUrl: u.toString() });
}

describe(`the job queue on ${serverUrl ? 'PostgreSQL' : 'PGlite'}`, () => {
  it('gives each of 40 jobs to exactly one of 6 concurrent workers', async () => {
    const handle = await open();
    cleanups.push(() => handle.close());
    setDbHandle(handle);
    const ids = new Set<number>();
    for (let i = 0; i < 40; i++) ids.add(await enqueue('race.test', { i }));

    const claimed: number[] = [];
    const worker = async () => {
      for (;;) {
        const job = await claimJob(['race.test'], 60_000);
        if (!job) return;
        claimed.push(job.id);
        await new Promise((r) => setTimeout(r, Math.random() * 5));
        await completeJob(job.id);
      }
    };
    await Promise.all(Array.from({ length: 6 }, worker));

    expect(claimed.length).toBe(40);
    expect(new Set(claimed)).toEqual(ids);
    const rows = await handle.db.select({ state: jobs.state, attempts: jobs.attempts }).from(jobs).where(eq(jobs.queue, 'race.test'));
    expect(rows.every((r) => r.state === 'done' && r.attempts === 1)).toBe(true);
  });
});
