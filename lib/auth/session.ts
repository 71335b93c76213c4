import 'server-only';
import { cache } from 'react';
import { getServerSession } from 'next-auth';
import type { Role } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { authOptions } from './options';
import { hasRole } from './roles';
import { findAuthUserById, findSessionUser } from '@/lib/data/users';

export interface SessionUser {
  id: string;
  name: string;
  email: string;
  role: Role;
  tokenVersion: number;
}

/** The signed-in user for this request, or null. Cached per request. */
export const getCurrentUser = cache(async (): Promise<SessionUser | null> => {
  // No try/catch here: reading cookies throws Next's dynamic-rendering signal during prerender,
  // and swallowing it would freeze a signed-out page into the build.
  const session = await getServerSession(authOptions);
  const id = session?.user?.id;
  if (!id) return null;
  const auth = await findAuthUserById(id);
  if (!auth) return null;
  return findSessionUser(id, auth.tokenVersion);
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
