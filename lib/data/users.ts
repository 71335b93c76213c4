import 'server-only';
import { and, asc, desc, eq, ilike, or, sql } from 'drizzle-orm';
import { getDb, getDbHandle } from '@/db/client';
import { users, type Role } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { verifyPassword } from '@/lib/auth/password';
import type { SessionUser } from '@/lib/auth/session';
import { assertRole } from '@/lib/auth/roles';
import { cachedAccount, type Account } from '@/lib/auth/token-cache';
import { announceInvalidation } from './invalidation';

export interface UserDto {
  id: string;
  name: string | null;
  email: string;
  role: Role;
  disabled: boolean;
  digestOptIn: boolean;
  reminderOptIn: boolean;
  createdAt: string;
}

const dtoColumns = {
  id: users.id,
  name: users.name,
  email: users.email,
  role: users.role,
  disabled: users.disabled,
  digestOptIn: users.digestOptIn,
  reminderOptIn: users.reminderOptIn,
  createdAt: users.createdAt,
};

const toDto = (r: { createdAt: Date } & Omit<UserDto, 'createdAt'>): UserDto => ({ ...r, createdAt: r.createdAt.toISOString() });

/** Check a password sign-in. Returns null for any failure, without saying which part was wrong. */
export async function verifyCredentials(email: string, password: string) {
  const db = await getDb();
  const [u] = await db
    .select({
      id: users.id,
      name: users.name,
      email: users.email,
      role: users.role,
      disabled: users.disabled,
      tokenVersion: users.tokenVersion,
      passwordHash: users.passwordHash,
    })
    .from(users)
    .where(eq(users.email, email))
    .limit(1);
  const ok = await verifyPassword(password, u?.passwordHash);
  if (!ok || !u || u.disabled) return null;
  return { id: u.id, name: u.name, email: u.email, role: u.role, tokenVersion: u.tokenVersion };
}

/**
 * The account behind a session cookie, read at most once per process between writes
 * (lib/auth/token-cache.ts says when the copy in memory is exact).
 */
export async function findSessionAccount(id: string): Promise<Account | null> {
  const handle = await getDbHandle();
  return cachedAccount(handle, id, async () => {
    const [u] = await handle.db
      .select({ id: users.id, name: users.name, email: users.email, role: users.role, disabled: users.disabled, tokenVersion: users.tokenVersion })
      .from(users)
      .where(eq(users.id, id))
      .limit(1);
    return u ?? null;
  });
}

export async function isEmailAllowedToSignIn(email: string) {
  const db = await getDb();
  const [u] = await db.select({ disabled: users.disabled }).from(users).where(eq(users.email, email.toLowerCase())).limit(1);
  return !u || !u.disabled;
}

export async function hasActiveAccount(email: string) {
  const db = await getDb();
  const [u] = await db.select({ disabled: users.disabled }).from(users).where(eq(users.email, email.toLowerCase())).limit(1);
  return !!u && !u.disabled;
}

/** Ends every session of the user (sign-out, role change, disable). */
export async function bumpTokenVersion(id: string) {
  const db = await getDb();
  await db
    .update(users)
    .set({ tokenVersion: sql`${users.tokenVersion} + 1` })
    .where(eq(users.id, id));
  await announceInvalidation({ kind: 'account', id });
}

const sortable = { name: users.name, email: users.email, role: users.role, createdAt: users.createdAt } as const;
export type UserSort = keyof typeof sortable;

export async function listUsers(actor: SessionUser, opts: { q?: string; sort?: UserSort; dir?: 'asc' | 'desc' } = {}) {
  requireAdmin(actor);
  const db = await getDb();
  const q = opts.q?.trim();
  const where = q ? or(ilike(users.email, `%${escapeLike(q)}%`), ilike(users.name, `%${escapeLike(q)}%`)) : undefined;
  const col = sortable[opts.sort ?? 'createdAt'];
  const rows = await db
    .select(dtoColumns)
    .from(users)
    .where(where)
    .orderBy(opts.dir === 'desc' ? desc(col) : asc(col), asc(users.id))
    .limit(500);
  return rows.map(toDto);
}

export async function updateUserByAdmin(actor: SessionUser, id: string, patch: { role?: Role; disabled?: boolean }) {
  requireAdmin(actor);
  if (id === actor.id && (patch.disabled === true || (patch.role && patch.role !== 'admin'))) {
    throw new AppError('conflict:self', 'You cannot demote or disable your own account; ask another administrator.');
  }
  const db = await getDb();
  const rows = await db
    .update(users)
    .set({ ...patch, tokenVersion: sql`${users.tokenVersion} + 1` })
    .where(eq(users.id, id))
    .returning(dtoColumns);
  await announceInvalidation({ kind: 'account', id });
  if (!rows[0]) throw new AppError('not_found:user');
  return toDto(rows[0]);
}

export async function getProfile(actor: SessionUser): Promise<UserDto> {
  const db = await getDb();
  const [u] = await db.select(dtoColumns).from(users).where(eq(users.id, actor.id)).limit(1);
  if (!u) throw new AppError('not_found:user');
  return toDto(u);
}

export async function updateProfile(actor: SessionUser, patch: { name?: string; digestOptIn?: boolean; reminderOptIn?: boolean }) {
  // An empty patch changes nothing (and an UPDATE with no columns is an SQL error, not a 500 to show).
  if (Object.values(patch).every((v) => v === undefined)) return getProfile(actor);
  const db = await getDb();
  const [u] = await db
    .update(users)
    .set(patch)
    .where(and(eq(users.id, actor.id)))
    .returning(dtoColumns);
  await announceInvalidation({ kind: 'account', id: actor.id });
  if (!u) throw new AppError('not_found:user');
  return toDto(u);
}

function requireAdmin(actor: SessionUser) {
  assertRole(actor, 'admin', 'users', 'Only administrators manage users.');
}

export function escapeLike(s: string) {
  return s.replace(/[\\%_]/g, (c) => `\\${c}`);
}
