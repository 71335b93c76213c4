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

type SessionClaims = { uid: string; tv: number; exp: number };

// Decrypting a session cookie derives its key (HKDF) and opens the JWE on every request, a
// measurable share of a signed-in read. A cookie's claims never change, so they are kept by the
// cookie's exact value until the token expires. Only what decode() accepted is kept; the account
// (disabled, token version) is still checked on every request, so a sign-out or role change
// takes effect at once. One secret per process (every process of a cluster shares it), so the
// cookie alone is the key.
const DECODED_MAX = 2_000;
const g = globalThis as unknown as { __cwDecodedSessions?: Map<string, SessionClaims> };
const decoded = (g.__cwDecodedSessions ??= new Map());

async function decodeSession(raw: string): Promise<SessionClaims | null> {
  const now = Date.now() / 1000;
  const hit = decoded.get(raw);
  if (hit) {
    if (hit.exp > now) return hit;
    decoded.delete(raw);
  }
  let token: Awaited<ReturnType<typeof decode>>;
  try {
    token = await decode({ token: raw, secret: sessionKey() });
  } catch {
    return null;
  }
  if (!token || typeof token.uid !== 'string' || typeof token.tv !== 'number' || typeof token.exp !== 'number') return null;
  const claims = { uid: token.uid, tv: token.tv, exp: token.exp };
  decoded.set(raw, claims);
  if (decoded.size > DECODED_MAX) decoded.delete(decoded.keys().next().value!);
  return claims;
}

/**
 * The signed-in user for this request, or null. The cookie is decrypted once (next-auth's own
 * `decode`, which checks the expiry; decodeSession keeps its claims) and the account is checked once, from
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
  const token = await decodeSession(raw);
  if (!token) return null;
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
