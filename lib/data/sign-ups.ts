import 'server-only';
import { createHash, randomBytes } from 'node:crypto';
import { and, eq, gt, lt } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { pendingSignUps, users } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { env } from '@/lib/env';
import { hashPassword } from '@/lib/auth/password';
import { emailKey, takeToken } from '@/lib/auth/rate-limit';
import { sendAlreadyMember, sendSignUpConfirmation } from '@/lib/mail/templates';
import type { SignUpInput } from '@/lib/validation/auth';

// Sign-up answers the same whether or not the address has an account: the response is sent
// before anything is looked up, and what happens next is told to the owner of the address by
// e-mail. A new address gets a link that creates the account; an address with an account gets
// a note that someone tried, and the way to sign in.

const SIGN_UP_LINK_HOURS = 24;
/** Sign-up mails to one address per hour, whoever asks: enough to retry, too few to flood. */
const SIGN_UP_MAILS_PER_ADDRESS_PER_HOUR = 3;

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex');
const origin = () => new URL(env.NEXTAUTH_URL).origin;

/** Start a sign-up after the response has gone; failures are logged, never shown to the asker. */
export function queueSignUp(input: SignUpInput): void {
  setImmediate(() => {
    startSignUp(input).catch((e: unknown) => console.error('[candlewise] sign-up mail not sent', e));
  });
}

/** What a queued sign-up does; resolves to which mail went out, if any. */
async function startSignUp(input: SignUpInput): Promise<'confirm-sent' | 'member-told' | 'nothing'> {
  const email = emailKey(input.email);
  if (!(await takeToken(`signup-mail:${email}`, SIGN_UP_MAILS_PER_ADDRESS_PER_HOUR, 60 * 60_000))) return 'nothing';
  const db = await getDb();
  const [existing] = await db.select({ disabled: users.disabled }).from(users).where(eq(users.email, email)).limit(1);
  if (existing) {
    // A disabled account hears nothing: the administrator who disabled it decides what follows.
    if (existing.disabled) return 'nothing';
    await sendAlreadyMember(email, `${origin()}/sign-in?email=${encodeURIComponent(email)}`);
    return 'member-told';
  }
  const token = randomBytes(32).toString('base64url');
  const now = new Date();
  await db.delete(pendingSignUps).where(lt(pendingSignUps.expiresAt, now));
  await db.insert(pendingSignUps).values({
    tokenHash: hashToken(token),
    email,
    name: input.name,
    passwordHash: await hashPassword(input.password),
    expiresAt: new Date(now.getTime() + SIGN_UP_LINK_HOURS * 3_600_000),
  });
  await sendSignUpConfirmation(email, input.name, `${origin()}/sign-up/confirm?token=${encodeURIComponent(token)}`, SIGN_UP_LINK_HOURS);
  return 'confirm-sent';
}

/**
 * Create the account a confirmation link stands for. The link works once; every other pending
 * sign-up for the address ends with it. When the address has meanwhile got an account (another
 * link of the same address), that account is left as it is and named in the answer.
 */
export async function confirmSignUp(token: string): Promise<{ email: string; created: boolean }> {
  const db = await getDb();
  return db.transaction(async (tx) => {
    const [pending] = await tx
      .delete(pendingSignUps)
      .where(and(eq(pendingSignUps.tokenHash, hashToken(token)), gt(pendingSignUps.expiresAt, new Date())))
      .returning();
    if (!pending) {
      throw new AppError('not_found:sign-up', 'This link has expired or has been used already. Sign in, or sign up again for a new link.');
    }
    await tx.delete(pendingSignUps).where(eq(pendingSignUps.email, pending.email));
    const created = await tx
      .insert(users)
      .values({ name: pending.name, email: pending.email, passwordHash: pending.passwordHash, role: 'member', emailVerified: new Date() })
      .onConflictDoNothing({ target: users.email })
      .returning({ id: users.id });
    return { email: pending.email, created: created.length > 0 };
  });
}
