import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';

vi.hoisted(() => {
  // Read by lib/env.ts at import: the mail fake on a port of this suite, a throwaway secret.
  process.env.SMTP_FAKE_PORT = '3433';
  process.env.SMTP_URL = '';
  process.env.NEXTAUTH_URL = 'http://127.0.0.1:3430';
  process.env.NEXTAUTH_SECRET = `unit-${Math.random().toString(36).slice(2)}-${Date.now().toString(36)}-reminders`;
});

import nodemailer from 'nodemailer';
import { and, eq, sql } from 'drizzle-orm';
import { openDatabase, type DbHandle } from '@/db/open';
import { setDbHandle } from '@/db/client';
import { seed } from '@/db/seed';
import { jobs, outboxMessages, reminderRunMembers, reminderSends, users } from '@/db/schema';
import { backoffMs, claimJob, enqueue, failJob, jobState } from '@/lib/data/jobs';
import { getReminderRun, mondayOf, reminderMessageId, startReminderRun } from '@/lib/data/reminders';
import { thisWeek } from '@/lib/data/plan';
import { sendNoteDigest, unsubscribeWithToken, unsubscribeUrlFor } from '@/lib/data/digests';
import { startFakeSmtp } from '@/lib/mail/fake-smtp';
import { runOneJob } from '@/lib/queue/worker';
import type { SessionUser } from '@/lib/auth/session';

let handle: DbHandle;
let admin: SessionUser;
let member: SessionUser;
let smtp: Awaited<ReturnType<typeof startFakeSmtp>>;

const asActor = (u: typeof users.$inferSelect): SessionUser => ({ id: u.id, name: u.name ?? '', email: u.email, role: u.role, tokenVersion: u.tokenVersion });

beforeAll(async () => {
  handle = await openDatabase({ pgliteDir: 'memory' });
  setDbHandle(handle);
  await seed(handle.db);
  smtp = await startFakeSmtp(3433);
  const [a] = await handle.db.select().from(users).where(eq(users.email, 'admin@candlewise.test'));
  const [m] = await handle.db.select().from(users).where(eq(users.email, 'member@candlewise.test'));
  admin = asActor(a);
  member = asActor(m);
});
afterAll(async () => {
  await new Promise<void>((r) => smtp.close(() => r()));
  await handle?.close();
});

/** Run due jobs until none is left. */
async function drain() {
  for (let i = 0; i < 200 && (await runOneJob({ backoffBaseMs: 60_000 })); i++);
}
const remindersTo = (email: string) =>
  handle.db
    .select()
    .from(outboxMessages)
    .where(and(sql`${outboxMessages.envelopeTo} @> ${JSON.stringify([email])}::jsonb`, sql`${outboxMessages.subject} like '%your trees in the week of%'`));

describe('the job queue', () => {
  it('keys jobs, leases a claimed job, retries with growing backoff and gives up after the last attempt', async () => {
    const id = await enqueue('test.queue', { n: 1 }, { dedupeKey: 'test:1', maxAttempts: 2 });
    expect(await enqueue('test.queue', { n: 2 }, { dedupeKey: 'test:1' })).toBe(id);

    const job = (await claimJob(['test.queue'], 60_000))!;
    expect(job).toMatchObject({ id, attempts: 1, payload: { n: 1 } });
    expect(await claimJob(['test.queue'], 60_000)).toBeNull(); // held by its lease

    const before = Date.now();
    expect(await failJob(job, 'smtp down', 1000)).toBe('retry');
    const s = (await jobState(id))!;
    expect(s.state).toBe('queued');
    expect(s.runAt.getTime()).toBeGreaterThanOrEqual(before + 1000);
    expect(await claimJob(['test.queue'], 60_000)).toBeNull(); // not due yet

    await handle.db
      .update(jobs)
      .set({ runAt: new Date(Date.now() - 1) })
      .where(eq(jobs.id, id));
    const again = (await claimJob(['test.queue'], 60_000))!;
    expect(again.attempts).toBe(2);
    expect(await failJob(again, 'still down')).toBe('failed');
    expect((await jobState(id))!.state).toBe('failed');
    expect(await claimJob(['test.queue'], 60_000)).toBeNull();
  });

  it('claims again a job whose worker stopped holding it (lease ran out)', async () => {
    const id = await enqueue('test.lease', {});
    expect((await claimJob(['test.lease'], 1))!.id).toBe(id);
    await new Promise((r) => setTimeout(r, 10));
    const again = (await claimJob(['test.lease'], 60_000))!;
    expect(again).toMatchObject({ id, attempts: 2 });
  });

  it('backs off 2 s, 4 s, 8 s … up to ten minutes', () => {
    expect([1, 2, 3, 4].map((a) => backoffMs(a))).toEqual([2000, 4000, 8000, 16000]);
    expect(backoffMs(30)).toBe(600_000);
  });
});

describe('the meeting-note digest through the queue', () => {
  it('queues one job per opted-in member with the send, and each copy is stored once, even when handed over twice', async () => {
    const [lib] = await handle.db.select().from(users).where(eq(users.email, 'librarian@candlewise.test'));
    const slug = '2026-04-18-spring-candle-evening';
    const digestsTo = (email: string) =>
      handle.db
        .select()
        .from(outboxMessages)
        .where(and(sql`${outboxMessages.envelopeTo} @> ${JSON.stringify([email])}::jsonb`, sql`${outboxMessages.subject} like '%meeting of%'`));
    const optedIn = await handle.db.select({ email: users.email }).from(users).where(eq(users.digestOptIn, true));
    expect(optedIn.length).toBeGreaterThanOrEqual(3);

    const res = await sendNoteDigest(asActor(lib), slug, { confirm: true });
    expect(res.recipients).toBe(optedIn.length);
    // Nothing has gone out yet: the mail is the queue's work.
    expect(await digestsTo(member.email)).toHaveLength(0);
    const queued = await handle.db.select().from(jobs).where(eq(jobs.queue, 'digest.member'));
    expect(queued).toHaveLength(optedIn.length);
    await drain();
    for (const { email } of optedIn) expect(await digestsTo(email), email).toHaveLength(1);

    // A crash after the hand-over, before the job was marked done: the retry is stored once.
    await handle.db
      .update(jobs)
      .set({ state: 'queued', runAt: new Date(Date.now() - 1) })
      .where(eq(jobs.queue, 'digest.member'));
    await drain();
    for (const { email } of optedIn) expect(await digestsTo(email), email).toHaveLength(1);
    expect(await digestsTo('member2@candlewise.test')).toHaveLength(0); // did not opt in
  });
});

describe('weekly reminders', () => {
  let runId = '';

  it('only an administrator starts a run', async () => {
    await expect(startReminderRun(member, '2027-05-10')).rejects.toMatchObject({ status: 403 });
    expect(mondayOf('2027-05-16')).toBe('2027-05-10'); // a Sunday belongs to the week before it
    expect(mondayOf('2027-05-10')).toBe('2027-05-10');
  });

  it('sends the demo member one mail listing their Scots pine’s candle work for a week in May', async () => {
    const run = await startReminderRun(admin, '2027-05-13');
    runId = run.id;
    expect(run).toMatchObject({ weekOf: '2027-05-10', total: null, finished: false });
    await drain();
    expect(await getReminderRun(admin, run.id)).toMatchObject({ total: 1, sent: 1, skipped: 0, failed: 0, pending: 0, finished: true });
    const mails = await remindersTo(member.email);
    expect(mails).toHaveLength(1);
    expect(mails[0].subject).toBe('Riverside Pine Study Group: your trees in the week of 10 May 2027');
    expect(mails[0].text).toContain('Weir-side Scots');
    expect(mails[0].text).toContain('Pinch or shorten candles');
    expect(mails[0].html).toContain('Stop these e-mails');
    expect(mails[0].raw).toMatch(/^List-Unsubscribe:\s+<http:\/\/127\.0\.0\.1:3430\/api\/unsubscribe\?token=/m);
    expect(mails[0].raw).toMatch(/^List-Unsubscribe-Post: List-Unsubscribe=One-Click/m);
    // The same tasks as "This week" for those seven days: one source of what is due.
    const week = await thisWeek(member, '2027-05-10', 6);
    for (const it of week) expect(mails[0].text).toContain(it.window.label);
  });

  it('a second run of the week sends nothing again', async () => {
    const second = await startReminderRun(admin, '2027-05-10');
    await drain();
    expect(await getReminderRun(admin, second.id)).toMatchObject({ total: 1, sent: 0, skipped: 1, finished: true });
    expect(await remindersTo(member.email)).toHaveLength(1);
  });

  it('after a crash between the hand-over and its bookkeeping the retry is stored once', async () => {
    // The state a kill leaves: the message is in the outbox, the ledger still says `sending`,
    // the member's job is due again.
    await handle.db.update(reminderSends).set({ state: 'sending' }).where(eq(reminderSends.runId, runId));
    await handle.db.update(reminderRunMembers).set({ outcome: null }).where(eq(reminderRunMembers.runId, runId));
    await handle.db
      .update(jobs)
      .set({ state: 'queued', runAt: new Date(Date.now() - 1) })
      .where(eq(jobs.dedupeKey, `reminder:${runId}:${member.id}`));
    await drain();
    const mails = await remindersTo(member.email);
    expect(mails).toHaveLength(1);
    expect(mails[0].messageId).toBe(reminderMessageId('2027-05-10', member.id));
    const [ledger] = await handle.db.select().from(reminderSends).where(eq(reminderSends.runId, runId));
    expect(ledger.state).toBe('sent');
    expect(await getReminderRun(admin, runId)).toMatchObject({ sent: 1, finished: true });
  });

  it('a failed hand-over is retried later, and then sent', async () => {
    let monday = '2027-04-05';
    while ((await thisWeek(member, monday, 6)).length === 0 || monday === '2027-05-10')
      monday = mondayOf(new Date(Date.parse(`${monday}T00:00:00Z`) + 7 * 864e5).toISOString().slice(0, 10));
    const g = globalThis as unknown as { __cwMail?: unknown };
    const working = g.__cwMail;
    g.__cwMail = nodemailer.createTransport('smtp://127.0.0.1:3434'); // nothing listens there
    try {
      const run = await startReminderRun(admin, monday);
      await drain();
      expect(await getReminderRun(admin, run.id)).toMatchObject({ total: 1, sent: 0, failed: 0, finished: false });
      const [job] = await handle.db
        .select()
        .from(jobs)
        .where(eq(jobs.dedupeKey, `reminder:${run.id}:${member.id}`));
      expect(job).toMatchObject({ state: 'queued', attempts: 1 });
      expect(job.lastError).toMatch(/ECONNREFUSED/);
      expect(job.runAt.getTime()).toBeGreaterThan(Date.now() + 30_000);
      g.__cwMail = working;
      await handle.db
        .update(jobs)
        .set({ runAt: new Date(Date.now() - 1) })
        .where(eq(jobs.id, job.id));
      await drain();
      expect(await getReminderRun(admin, run.id)).toMatchObject({ sent: 1, finished: true });
      expect(await remindersTo(member.email)).toHaveLength(2);
    } finally {
      g.__cwMail = working;
    }
  });

  it('the link in the mail stops the reminders only; the meeting-notes link still stops the notes', async () => {
    const [mail] = await remindersTo(member.email);
    const token = decodeURIComponent(/\/unsubscribe\?token=([^\s)]+)/.exec(mail.text!)![1]);
    expect(await unsubscribeWithToken(token)).toEqual({ email: member.email, list: 'reminders' });
    const [after] = await handle.db.select().from(users).where(eq(users.id, member.id));
    expect(after).toMatchObject({ reminderOptIn: false, digestOptIn: true });

    const run = await startReminderRun(admin, '2027-05-17');
    await drain();
    expect(await getReminderRun(admin, run.id)).toMatchObject({ total: 0, sent: 0, finished: true });

    const digestToken = decodeURIComponent(new URL(unsubscribeUrlFor(member.id)).searchParams.get('token')!);
    expect(await unsubscribeWithToken(digestToken)).toEqual({ email: member.email, list: 'digest' });
    const [last] = await handle.db.select().from(users).where(eq(users.id, member.id));
    expect(last).toMatchObject({ reminderOptIn: false, digestOptIn: false });
  });
});
