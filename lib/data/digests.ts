import 'server-only';
import { createHash } from 'node:crypto';
import { and, count, desc, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { digestSends, notes, users } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { env } from '@/lib/env';
import { unsubscribeKey } from '@/lib/auth/secret';
import { sendMail } from '@/lib/mail/transport';
import { renderDigest } from '@/lib/mail/digest';
import { createUnsubscribeToken, verifyUnsubscribeToken, type MailList } from '@/lib/mail/unsubscribe';
import { getNote } from '@/lib/data/notes';
import { renderNoteWithLinks } from '@/lib/data/note-render';
import { getClubSettings } from '@/lib/data/settings';
import { enqueue, notifyQueued, type Job } from '@/lib/data/jobs';
import type { SessionUser } from '@/lib/auth/session';
import { assertRole } from '@/lib/auth/roles';

// The e-mail digest: a published note sent to every active member who opted in, one message
// each (each carries its own unsubscribe link), every send recorded in digest_sends. The
// messages go out through the job queue (lib/data/jobs.ts), one job per member.

export interface DigestSendDto {
  sentAt: string;
  recipients: number;
  senderName: string;
}

/** A second send of the same note needs `{ confirm: true }`; the 409 says when it last went out. */
class DigestAlreadySentError extends AppError {
  constructor(readonly previous: DigestSendDto) {
    super('conflict:digest_already_sent', `This note was already sent on ${previous.sentAt.slice(0, 10)} to ${previous.recipients} members. Send it again?`);
  }
  override toBody() {
    const body = super.toBody();
    return { error: { ...body.error, previous: this.previous } };
  }
}

function requireWriter(actor: SessionUser) {
  assertRole(actor, 'librarian', 'notes', 'Only librarians and administrators send meeting notes.');
}

export function unsubscribeUrlFor(userId: string, now = Date.now(), list: MailList = 'digest'): string {
  const token = createUnsubscribeToken(userId, unsubscribeKey(), now, list);
  return `${new URL(env.NEXTAUTH_URL).origin}/unsubscribe?token=${encodeURIComponent(token)}`;
}

async function sendsOf(noteId: number): Promise<DigestSendDto[]> {
  const db = await getDb();
  const rows = await db
    .select({ sentAt: digestSends.sentAt, recipients: digestSends.recipients, senderName: users.name })
    .from(digestSends)
    .leftJoin(users, eq(users.id, digestSends.senderId))
    .where(eq(digestSends.noteId, noteId))
    .orderBy(desc(digestSends.sentAt), desc(digestSends.id));
  return rows.map((r) => ({ sentAt: r.sentAt.toISOString(), recipients: r.recipients, senderName: r.senderName?.trim() || 'A former member' }));
}

const optedIn = and(eq(users.digestOptIn, true), eq(users.disabled, false));

export async function digestStatus(actor: SessionUser, slug: string): Promise<{ sends: DigestSendDto[]; optedIn: number; published: boolean }> {
  requireWriter(actor);
  const note = await getNote(actor, slug);
  const db = await getDb();
  const [{ n }] = await db.select({ n: count() }).from(users).where(optedIn);
  return { sends: await sendsOf(note.id), optedIn: n, published: note.status === 'published' };
}

export interface DigestPreviewDto {
  subject: string;
  html: string;
  text: string;
  recipients: number;
  published: boolean;
}

/**
 * The digest exactly as a member will get it (the unsubscribe link is the viewer's own, each
 * member gets theirs), and how many members it would go to. Writes nothing.
 */
export async function previewNoteDigest(actor: SessionUser, slug: string): Promise<DigestPreviewDto> {
  requireWriter(actor);
  const note = await getNote(actor, slug);
  const db = await getDb();
  const [[{ n }], settings, { html, resolutions }] = await Promise.all([
    db.select({ n: count() }).from(users).where(optedIn),
    getClubSettings(),
    renderNoteWithLinks(note.body),
  ]);
  const baseUrl = new URL(env.NEXTAUTH_URL).origin;
  const mail = await renderDigest({ clubName: settings.clubName, baseUrl, note, html, resolutions, unsubscribeUrl: unsubscribeUrlFor(actor.id) });
  return { subject: mail.subject, html: mail.html, text: mail.text, recipients: n, published: note.status === 'published' };
}

export async function sendNoteDigest(
  actor: SessionUser,
  slug: string,
  opts: { confirm?: boolean } = {},
): Promise<{ sentAt: string; recipients: number; failed: number }> {
  requireWriter(actor);
  const note = await getNote(actor, slug);
  if (note.status !== 'published') {
    throw new AppError('conflict:note_not_published', 'Publish the note before sending it to members.');
  }
  const db = await getDb();
  const recipients = await db.select({ id: users.id, email: users.email }).from(users).where(optedIn).orderBy(users.email);

  // Claim the send in a short transaction (the note row locked, so two librarians clicking at
  // once cannot both send), queuing one job per member in it; the job queue sends the mail after
  // it commits, retrying with backoff, never while a lock is held.
  const sendId = await db.transaction(async (tx) => {
    await tx.select({ id: notes.id }).from(notes).where(eq(notes.id, note.id)).for('update');
    const [prev] = await tx
      .select({ sentAt: digestSends.sentAt, recipients: digestSends.recipients, senderName: users.name })
      .from(digestSends)
      .leftJoin(users, eq(users.id, digestSends.senderId))
      .where(eq(digestSends.noteId, note.id))
      .orderBy(desc(digestSends.sentAt), desc(digestSends.id))
      .limit(1);
    if (prev && opts.confirm !== true) {
      throw new DigestAlreadySentError({
        sentAt: prev.sentAt.toISOString(),
        recipients: prev.recipients,
        senderName: prev.senderName?.trim() || 'A former member',
      });
    }
    const [row] = await tx
      .insert(digestSends)
      .values({ noteId: note.id, senderId: actor.id, recipients: recipients.length })
      .returning({ id: digestSends.id, sentAt: digestSends.sentAt });
    // One job per member, committed with the send: the server's queue delivers them.
    for (const r of recipients) {
      await enqueue(DIGEST_MEMBER_QUEUE, { sendId: row.id, userId: r.id }, { dedupeKey: `digest:${row.id}:${r.id}` }, tx);
    }
    return row;
  });

  notifyQueued();
  return { sentAt: sendId.sentAt.toISOString(), recipients: recipients.length, failed: 0 };
}

export const DIGEST_MEMBER_QUEUE = 'digest.member';

/** The Message-ID of one member's copy of one send: the same on every hand-over. */
function digestMessageId(sendId: number, userId: string): string {
  const host = new URL(env.NEXTAUTH_URL).hostname || 'candlewise.invalid';
  return `<digest.${sendId}.${createHash('sha256').update(userId).digest('hex').slice(0, 24)}@${host}>`;
}

/**
 * Job: one member's copy of a send. Read as that member sees the note (a note unpublished since
 * is not sent), skipped if they turned the notes off meanwhile; a retry after a crash hands the
 * message over with the same Message-ID, which the outbox stores once.
 */
export async function handleDigestMemberJob(job: Job) {
  const sendId = Number(job.payload.sendId);
  const userId = String(job.payload.userId);
  const db = await getDb();
  const [row] = await db
    .select({
      slug: notes.slug,
      id: users.id,
      name: users.name,
      email: users.email,
      role: users.role,
      tokenVersion: users.tokenVersion,
      digestOptIn: users.digestOptIn,
      disabled: users.disabled,
    })
    .from(digestSends)
    .innerJoin(notes, eq(notes.id, digestSends.noteId))
    .innerJoin(users, eq(users.id, userId))
    .where(eq(digestSends.id, sendId))
    .limit(1);
  if (!row || !row.digestOptIn || row.disabled) return;
  const member: SessionUser = { id: row.id, name: row.name ?? '', email: row.email, role: row.role, tokenVersion: row.tokenVersion };
  let note;
  try {
    note = await getNote(member, row.slug);
  } catch (e) {
    if (e instanceof AppError && e.status === 404) return;
    throw e;
  }
  const [settings, { html, resolutions }] = await Promise.all([getClubSettings(), renderNoteWithLinks(note.body)]);
  const baseUrl = new URL(env.NEXTAUTH_URL).origin;
  const mail = await renderDigest({ clubName: settings.clubName, baseUrl, note, html, resolutions, unsubscribeUrl: unsubscribeUrlFor(member.id) });
  await sendMail({ to: member.email, ...mail, messageId: digestMessageId(sendId, member.id) });
}

/** Turn off the list (meeting notes or reminders) a valid token names, for its member; no sign-in needed. */
export async function unsubscribeWithToken(token: string): Promise<{ email: string; list: MailList }> {
  const check = verifyUnsubscribeToken(token, unsubscribeKey());
  if (!check.ok) {
    throw check.reason === 'expired'
      ? new AppError('bad_request:token_expired', 'This link has expired. Sign in and turn the e-mails off on your profile page.', { token: ['Expired'] })
      : new AppError('bad_request:token', 'This link is not valid. Sign in and turn the e-mails off on your profile page.', { token: ['Not valid'] });
  }
  const db = await getDb();
  const change = check.list === 'reminders' ? { reminderOptIn: false } : { digestOptIn: false };
  const [u] = await db.update(users).set(change).where(eq(users.id, check.userId)).returning({ email: users.email });
  if (!u) throw new AppError('bad_request:token', 'This link is not valid any more.', { token: ['Unknown member'] });
  return { email: u.email, list: check.list };
}
