import type { Role } from '@/db/schema';
import { AppError } from '@/lib/errors';

export type { Role };

export const roleLabels: Record<Role, string> = {
  member: 'Member',
  editor: 'Species editor',
  librarian: 'Librarian',
  admin: 'Administrator',
};

/** Admin holds every right; the other roles each hold their own and a member's. */
export function hasRole(userRole: Role, needed: Role): boolean {
  if (userRole === 'admin') return true;
  if (needed === 'member') return true;
  return userRole === needed;
}

/**
 * The one authorization check of the data layer: the actor holds `role` (see hasRole), or a 403
 * `forbidden:<subject>`. A missing actor is a 401.
 */
export function assertRole(actor: { role: Role } | null | undefined, role: Role, subject: string, message?: string): asserts actor is { role: Role } {
  if (!actor) throw new AppError('unauthorized:auth');
  if (!hasRole(actor.role, role)) throw new AppError(`forbidden:${subject}`, message);
}
