import { describe, expect, it } from 'vitest';
import { assertRole } from '@/lib/auth/roles';
import type { Role } from '@/db/schema';

// The data layer's one authorization check: admin holds every right, each other role its own
// and a member's; nobody signed in is a 401, a missing right a 403 naming the subject.
const ROLES: Role[] = ['member', 'editor', 'librarian', 'admin'];
const allowed: Record<Role, Role[]> = {
  member: ['member'],
  editor: ['member', 'editor'],
  librarian: ['member', 'librarian'],
  admin: ROLES,
};

describe('assertRole', () => {
  for (const actor of ROLES) {
    for (const needed of ROLES) {
      it(`${actor} ${allowed[actor].includes(needed) ? 'holds' : 'lacks'} ${needed}`, () => {
        const call = () => assertRole({ role: actor }, needed, 'thing');
        if (allowed[actor].includes(needed)) expect(call).not.toThrow();
        else expect(call).toThrow(expect.objectContaining({ status: 403, code: 'forbidden:thing' }));
      });
    }
  }
  it('refuses a missing actor with 401', () => {
    expect(() => assertRole(null, 'member', 'thing')).toThrow(expect.objectContaining({ status: 401 }));
  });
});
