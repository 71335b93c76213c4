import 'server-only';
import { cache } from 'react';
import { getServerSession, type AuthOptions } from 'next-auth';
import type { Role } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { authOptions } from './options';
import { hasRole } from './roles';

export interface SessionUser {
  id: string;
  name: string;
  email: string;
  role: Role;
  tokenVersion: number;
}

// The server's own view of the session: the same callbacks, plus the token version, which the
// browser's copy at /api/auth/session does not need to carry.
// Copied by descriptor, not spread: the secret is a getter read at request time (a spread would
// read it at import, during the build).
const serverOptions = Object.defineProperties({}, Object.getOwnPropertyDescriptors(authOptions)) as AuthOptions;
serverOptions.callbacks = {
  ...authOptions.callbacks,
  async session({ session, token }) {
    if (typeof token.uid !== 'string' || typeof token.tv !== 'number') return {} as typeof session;
    return { ...session, user: { id: token.uid, role: token.role, name: token.name, email: token.email, tokenVersion: token.tv } } as typeof session;
  },
};

/**
 * The signed-in user for this request, or null. The cookie is decoded once and the account is
 * checked once, in the jwt callback (lib/auth/options.ts, through lib/auth/token-cache.ts); what it
 * found is read back from the session here, not from the database again. Cached per render by
 * React; route handlers call it once, in route().
 */
export const getCurrentUser = cache(async (): Promise<SessionUser | null> => {
  // No try/catch here: reading cookies throws Next's dynamic-rendering signal during prerender,
  // and swallowing it would freeze a signed-out page into the build.
  const session = await getServerSession(serverOptions);
  const u = session?.user as (NonNullable<typeof session>['user'] & { tokenVersion?: number }) | undefined;
  if (!u?.id || !u.email || typeof u.tokenVersion !== 'number') return null;
  return { id: u.id, name: u.name ?? u.email.split('@')[0], email: u.email, role: u.role as Role, tokenVersion: u.tokenVersion };
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
