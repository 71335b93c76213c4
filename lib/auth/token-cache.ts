import 'server-only';
import type { Role } from '@/db/schema';

/** What a session needs to know of its account. */
export interface Account {
  id: string;
  name: string | null;
  email: string;
  role: Role;
  disabled: boolean;
  tokenVersion: number;
}

// The account behind a session cookie (role, disabled, token version, name, e-mail), kept in this
// process so a signed-in request reads it from memory instead of the database.
//
// Correctness rests on one rule: every write to those columns calls invalidate(id) once it has
// committed, through announceInvalidation (lib/data/invalidation.ts; bumpTokenVersion, updateUserByAdmin, updateProfile, the adapter's user writes; sign-out
// goes through bumpTokenVersion). A request that starts after the write then loads the account
// afresh, so a role change, a disable or a sign-out takes effect on the very next request.
//
// Several server processes: PGlite allows one process per data directory (lib's lock file), so
// there every write is made here and the cache is exact. On PostgreSQL another process may write;
// its writers announce it on the invalidation channel (lib/data/invalidation.ts, LISTEN/NOTIFY),
// whose listener in this process calls invalidate(). The cache is used there only while that
// listener is live (setAccountCacheShared, per database handle), and every entry also expires
// after ACCOUNT_TTL_MS, the fallback should a notification ever be missed. Without a live listener
// the cache keeps nothing: every request reads the account once.

// Keyed by account id, then by database handle (tests open several in-memory databases in one
// process and must never see each other's rows).
type Entry = { value: Promise<Account | null>; expires: number };
const g = globalThis as unknown as { __cwAccountCache?: Map<string, WeakMap<object, Entry>>; __cwAccountSharedDbs?: WeakSet<object> };
const byId = (g.__cwAccountCache ??= new Map());
const shared = (g.__cwAccountSharedDbs ??= new WeakSet());

/** How long an account read on PostgreSQL is trusted at most (on PGlite: until a write). */
export const ACCOUNT_TTL_MS = 30_000;

/** PostgreSQL: whether this process hears every other process's account writes on `db`. */
export function setAccountCacheShared(db: object, on: boolean) {
  if (on) shared.add(db);
  else shared.delete(db);
}

/** The account for a session, from memory when this process can know it is current. */
export function cachedAccount(
  handle: { db: object; kind: 'pglite' | 'postgres' },
  id: string,
  loadAccount: () => Promise<Account | null>,
): Promise<Account | null> {
  if (handle.kind === 'postgres' && !shared.has(handle.db)) return loadAccount();
  let perDb = byId.get(id);
  if (!perDb) byId.set(id, (perDb = new WeakMap()));
  const hit = perDb.get(handle.db);
  const now = Date.now();
  if (hit && hit.expires > now) return hit.value;
  const map = perDb;
  const entry: Entry = { value: loadAccount(), expires: handle.kind === 'postgres' ? now + ACCOUNT_TTL_MS : Infinity };
  map.set(handle.db, entry);
  // Neither a failed load nor an unknown id is kept.
  const drop = () => {
    if (map.get(handle.db) === entry) map.delete(handle.db);
  };
  entry.value.then((a) => a ?? drop(), drop);
  return entry.value;
}

/**
 * After a write to an account has committed: the next read goes to the database. Without an id,
 * every account is dropped (bulk writes, restores).
 */
export function invalidate(id?: string) {
  if (id === undefined) byId.clear();
  else byId.delete(id);
}
