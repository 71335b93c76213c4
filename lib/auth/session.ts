import 'server-only';
import { cache } from 'react';
import { cookies } from 'next/headers';
import { decode } from 'next-auth/jwt';
import type { Role } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { env } from '@/lib/env';
import { findSessionAccount } from '@/lib/data/users';
import { sessionKey } from './secret';
import { hasRole } from './roles';

export interface SessionUser {
  id: string;
  name: string;
  email: string;
  role: Role;
  tokenVersion: number;
}

const SESSION_COOKIE = 'next-auth.session-token';

/** The session cookie's value (next-auth splits a large one into `.0`, `.1`, … chunks). */
async function sessionCookie(): Promise<string | null> {
  const jar = await cookies();
  const name = `${env.secureCookies ? '__Secure-' : ''}${SESSION_COOKIE}`;
  const whole = jar.get(name)?.value;
  if (whole) return whole;
  const chunks = jar
    .getAll()
    .filter((c) => c.name.startsWith(`${name}.`))
    .sort((a, b) => Number(a.name.slice(name.length + 1)) - Number(b.name.slice(name.length + 1)));
  return chunks.length ? chunks.map((c) => c.value).join('') : null;
}

/**
 * The signed-in user for this request, or null. The cookie is decrypted once (next-auth's own
 * `decode`, which checks the expiry) and the account is checked once, from
 * lib/auth/token-cache.ts: a disabled account or a token from before the last sign-out or role
 * change (token version) is refused. getServerSession would run the same check and then
 * encrypt a fresh token that a server component cannot even set. Cached per render by React;
 * route handlers call it once, in route().
 */
export const getCurrentUser = cache(async (): Promise<SessionUser | null> => {
  // No try/catch around cookies(): reading them throws Next's dynamic-rendering signal during
  // prerender, and swallowing it would freeze a signed-out page into the build.
  const raw = await sessionCookie();
  if (!raw) return null;
  let token: Awaited<ReturnType<typeof decode>>;
  try {
    token = await decode({ token: raw, secret: sessionKey() });
  } catch {
    return null;
  }
  if (!token || typeof token.uid !== 'string' || typeof token.tv !== 'number') return null;
  const u = await findSessionAccount(token.uid);
  if (!u || u.disabled || u.tokenVersion !== token.tv) return null;
  return { id: u.id, name: u.name ?? u.email.split('@')[0], email: u.email, role: u.role, tokenVersion: u.tokenVersion };
});

export async function requireUser(): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) throw new AppError('unauthorized:auth');
  return user;
}

export async function requireRole(role: Role, subject = 'resource'): Promise<SessionUser> {
  const user = await requireUser();
  if (!hasRole(user.role, role)) throw new AppError(`forbidden:${subject}`);
  return user;
}
