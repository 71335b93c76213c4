import 'server-only';
import { createHash } from 'node:crypto';
import { and, count, desc, eq, isNotNull, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { reminderRunMembers, reminderRuns, reminderSends, users } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { env } from '@/lib/env';
import { newPublicId } from '@/lib/ids';
import { assertRole } from '@/lib/auth/roles';
import type { SessionUser } from '@/lib/auth/session';
import { addDays } from '@/lib/season/degree-days';
import { todayIso } from '@/lib/validation/trees';
import { sendMail } from '@/lib/mail/transport';
import { renderReminder } from '@/lib/mail/reminder';
import { enqueue, notifyQueued, type Job } from '@/lib/data/jobs';
import { thisWeek } from '@/lib/data/plan';
import { getClubSettings } from '@/lib/data/settings';
import { unsubscribeUrlFor } from '@/lib/data/digests';

// The weekly reminder. An administrator starts a run for a week; the queue (lib/data/jobs.ts,
// lib/queue/worker.ts) lists the opted-in members in one job and settles each member in a job of
// its own. What is due comes from the member's "This week" (lib/data/plan.ts, the same plan the
// home page shows), limited to the seven days of the week.
//
// Never twice: reminder_sends has one row per (week, member). The row is written, as `sending`
// with a fixed Message-ID, before the message is handed to SMTP, and set to `sent` after. A second
// run of the same week finds the row and skips the member. A crash between the two writes leaves
// `sending`: the same run's retry hands the message over again with the SAME Message-ID, which the
// outbox (and mail stores that de-duplicate by Message-ID) keeps once. No other run touches it.

export const REMINDER_RUN_QUEUE = 'reminders.run';
export const REMINDER_MEMBER_QUEUE = 'reminders.member';
/** The days of a reminder's week after its Monday. */
const WEEK_DAYS = 6;

/** The Monday of the ISO week that holds `iso`. */
export function mondayOf(iso: string): string {
  const day = new Date(`${iso}T00:00:00Z`).getUTCDay(); // 0 = Sunday
  return addDays(iso, -((day + 6) % 7));
}

export interface ReminderRunDto {
  id: string;
  weekOf: string;
  createdAt: string;
  /** Members the run looks at; null while it is still listing them. */
  total: number | null;
  sent: number;
  skipped: number;
  failed: number;
  pending: number | null;
  finished: boolean;
}

function requireAdmin(actor: SessionUser) {
  assertRole(actor, 'admin', 'reminders', 'Only administrators send the weekly reminders.');
}

/** Queue a run for the week holding `weekOf` (default: this week). Returns at once. */
export async function startReminderRun(actor: SessionUser, weekOf?: string): Promise<ReminderRunDto> {
  requireAdmin(actor);
  const monday = mondayOf(weekOf ?? todayIso());
  const db = await getDb();
  const id = newPublicId();
  await db.transaction(async (tx) => {
    await tx.insert(reminderRuns).values({ id, weekOf: monday, requestedBy: actor.id });
    await enqueue(REMINDER_RUN_QUEUE, { runId: id }, { dedupeKey: `reminder-run:${id}` }, tx);
  });
  notifyQueued();
  return (await runById(id))!;
}

async function runById(id: string): Promise<ReminderRunDto | null> {
  const db = await getDb();
  const [run] = await db.select().from(reminderRuns).where(eq(reminderRuns.id, id)).limit(1);
  if (!run) return null;
  const outcomes = await db
    .select({ outcome: reminderRunMembers.outcome, n: count() })
    .from(reminderRunMembers)
    .where(and(eq(reminderRunMembers.runId, id), isNotNull(reminderRunMembers.outcome)))
    .groupBy(reminderRunMembers.outcome);
  const of = (o: string) => outcomes.find((r) => r.outcome === o)?.n ?? 0;
  const sent = of('sent');
  const skipped = of('skipped');
  const failed = of('failed');
  const pending = run.total === null ? null : run.total - sent - skipped - failed;
  return { id, weekOf: run.weekOf, createdAt: run.createdAt.toISOString(), total: run.total, sent, skipped, failed, pending, finished: pending === 0 };
}

export async function getReminderRun(actor: SessionUser, id: string): Promise<ReminderRunDto> {
  requireAdmin(actor);
  const run = await runById(id);
  if (!run) throw new AppError('not_found:reminder_run', 'No such reminder run.');
  return run;
}

export async function listReminderRuns(actor: SessionUser, limit = 10): Promise<ReminderRunDto[]> {
  requireAdmin(actor);
  const db = await getDb();
  const rows = await db.select({ id: reminderRuns.id }).from(reminderRuns).orderBy(desc(reminderRuns.createdAt), desc(reminderRuns.id)).limit(limit);
  return (await Promise.all(rows.map((r) => runById(r.id)))).filter((r): r is ReminderRunDto => r !== null);
}

const optedIn = and(eq(users.reminderOptIn, true), eq(users.disabled, false));

/** Job: list the run's members and queue one job each. Safe to repeat (all of it is keyed). */
export async function handleRunJob(job: Job) {
  const runId = String(job.payload.runId);
  const db = await getDb();
  await db.transaction(async (tx) => {
    const [run] = await tx.select({ id: reminderRuns.id }).from(reminderRuns).where(eq(reminderRuns.id, runId)).for('update');
    if (!run) return;
    const members = await tx.select({ id: users.id }).from(users).where(optedIn).orderBy(users.email);
    if (members.length) {
      await tx
        .insert(reminderRunMembers)
        .values(members.map((m) => ({ runId, userId: m.id })))
        .onConflictDoNothing();
    }
    for (const m of members) {
      await enqueue(REMINDER_MEMBER_QUEUE, { runId, userId: m.id }, { dedupeKey: `reminder:${runId}:${m.id}` }, tx);
    }
    const [{ n }] = await tx.select({ n: count() }).from(reminderRunMembers).where(eq(reminderRunMembers.runId, runId));
    await tx.update(reminderRuns).set({ total: n }).where(eq(reminderRuns.id, runId));
  });
}

async function settle(runId: string, userId: string, outcome: 'sent' | 'skipped' | 'failed', reason: string | null) {
  const db = await getDb();
  await db
    .update(reminderRunMembers)
    .set({ outcome, reason })
    .where(and(eq(reminderRunMembers.runId, runId), eq(reminderRunMembers.userId, userId)));
}

/** The Message-ID of a member's reminder for a week: the same on every hand-over. */
export function reminderMessageId(weekOf: string, userId: string): string {
  const host = new URL(env.NEXTAUTH_URL).hostname || 'candlewise.invalid';
  const tag = createHash('sha256').update(`${weekOf}:${userId}`).digest('hex').slice(0, 24);
  return `<reminder.${weekOf}.${tag}@${host}>`;
}

/** Job: settle one member of a run: send the week's reminder, or skip them, at most once a week. */
export async function handleMemberJob(job: Job) {
  const runId = String(job.payload.runId);
  const userId = String(job.payload.userId);
  const db = await getDb();
  const [run] = await db.select({ weekOf: reminderRuns.weekOf }).from(reminderRuns).where(eq(reminderRuns.id, runId)).limit(1);
  if (!run) return;
  const weekOf = run.weekOf;

  const ledgerOf = async () =>
    (
      await db
        .select()
        .from(reminderSends)
        .where(and(eq(reminderSends.weekOf, weekOf), eq(reminderSends.userId, userId)))
        .limit(1)
    )[0];

  let ledger = await ledgerOf();
  if (ledger && ledger.runId !== runId) return settle(runId, userId, 'skipped', `already settled for this week by an earlier run (${ledger.state})`);
  if (ledger && ledger.state !== 'sending') return settle(runId, userId, ledger.state === 'sent' ? 'sent' : 'failed', ledger.reason);

  const [member] = await db
    .select({
      id: users.id,
      name: users.name,
      email: users.email,
      role: users.role,
      tokenVersion: users.tokenVersion,
      reminderOptIn: users.reminderOptIn,
      disabled: users.disabled,
    })
    .from(users)
    .where(eq(users.id, userId))
    .limit(1);
  if (!ledger && (!member || !member.reminderOptIn || member.disabled)) return settle(runId, userId, 'skipped', 'reminders turned off');
  if (!member) return settle(runId, userId, 'failed', 'member removed');

  const actor: SessionUser = { id: member.id, name: member.name ?? '', email: member.email, role: member.role, tokenVersion: member.tokenVersion };
  const items = await thisWeek(actor, weekOf, WEEK_DAYS);
  if (!ledger && items.length === 0) return settle(runId, userId, 'skipped', 'nothing due this week');

  const settings = await getClubSettings();
  const baseUrl = new URL(env.NEXTAUTH_URL).origin;
  const mail = await renderReminder({
    clubName: settings.clubName,
    baseUrl,
    weekOf,
    items,
    unsubscribeUrl: unsubscribeUrlFor(userId, Date.now(), 'reminders'),
  });

  if (!ledger) {
    const [mine] = await db
      .insert(reminderSends)
      .values({ weekOf, userId, runId, state: 'sending', messageId: reminderMessageId(weekOf, userId), tasks: mail.tasks })
      .onConflictDoNothing()
      .returning();
    // Another run claimed the member between our read and this write: it sends, we skip.
    if (!mine) return settle(runId, userId, 'skipped', 'already settled for this week by an earlier run');
    ledger = mine;
  }

  await sendMail({ to: member.email, subject: mail.subject, text: mail.text, html: mail.html, headers: mail.headers, messageId: ledger.messageId! });

  await db.transaction(async (tx) => {
    await tx
      .update(reminderSends)
      .set({ state: 'sent', updatedAt: sql`now()` })
      .where(eq(reminderSends.id, ledger.id));
    await tx
      .update(reminderRunMembers)
      .set({ outcome: 'sent', reason: null })
      .where(and(eq(reminderRunMembers.runId, runId), eq(reminderRunMembers.userId, userId)));
  });
}

/** The member job failed for good: record it (its ledger row stays, so no later run re-sends it). */
export async function onMemberJobFailed(job: Job, error: string) {
  const runId = String(job.payload.runId);
  const userId = String(job.payload.userId);
  const db = await getDb();
  await db
    .update(reminderSends)
    .set({ state: 'failed', reason: error.slice(0, 200) })
    .where(and(eq(reminderSends.runId, runId), eq(reminderSends.userId, userId), eq(reminderSends.state, 'sending')));
  await settle(runId, userId, 'failed', error.slice(0, 200));
}
