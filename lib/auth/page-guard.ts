import 'server-only';
import { forbidden, redirect } from 'next/navigation';
import type { Role } from '@/db/schema';
import { getCurrentUser, type SessionUser } from './session';
import { hasRole } from './roles';

/** For pages: send anonymous visitors to sign in and come back here. */
export async function requirePageUser(returnTo: string): Promise<SessionUser> {
  const user = await getCurrentUser();
  if (!user) redirect(`/sign-in?callbackUrl=${encodeURIComponent(returnTo)}`);
  return user;
}

/** For pages: a signed-in user without the role gets the 403 page. */
export async function requirePageRole(role: Role, returnTo: string): Promise<SessionUser> {
  const user = await requirePageUser(returnTo);
  if (!hasRole(user.role, role)) forbidden();
  return user;
}
