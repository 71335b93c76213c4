import type { Role } from '@/db/schema';

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
