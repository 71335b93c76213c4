import 'server-only';
import { PEER_HEADER, trustProxy } from '@/lib/http/client-address';
import { addHits, countHits, sharedLimitDb, takeHit } from '@/lib/data/rate-limits';

// Sign-in failures (one-minute windows), sign-in links and sign-ups (lib/data/sign-ups.ts and the
// routes), counted per normalised e-mail and per client.
//
// Where the counts live depends on the database:
// - PostgreSQL: several server processes may share it, so the counts are rows in `rate_limits`
//   (lib/data/rate-limits.ts), and ten failures spread over two processes lock the account.
// - PGlite: one process holds the data directory (db/lock.ts), so no other process can count, and
//   the counts stay in this process's memory as exact sliding windows. The table would work there
//   too, but every count would then be a query queued on PGlite's one connection behind the
//   page's own reads. Measured on an in-memory PGlite (2,000 failed-sign-in checks and counts in
//   a row, on a shared two-core machine): about 0.8 ms each through the table, about 1 µs in memory.
const WINDOW_MS = 60_000;
export const MAX_FAILURES_PER_EMAIL = 10;
const MAX_FAILURES_PER_IP = 100;

const g = globalThis as unknown as { __cwFailures?: Map<string, number[]> };
const failures: Map<string, number[]> = (g.__cwFailures ??= new Map());

function recent(key: string, now: number, windowMs = WINDOW_MS) {
  const list = (failures.get(key) ?? []).filter((t) => now - t < windowMs);
  if (list.length) failures.set(key, list);
  else failures.delete(key);
  return list;
}

/**
 * The key an e-mail address is counted under: the same for every spelling next-auth and the
 * credentials check treat as one account (case, surrounding space, Unicode compatibility forms).
 */
export function emailKey(email: unknown): string {
  return typeof email === 'string' ? email.normalize('NFKC').trim().toLowerCase() : '';
}

export async function isSignInBlocked(email: string, ip: string, now = Date.now()): Promise<boolean> {
  const [e, i] = [`e:${emailKey(email)}`, `i:${ip}`];
  const db = await sharedLimitDb();
  if (!db) return recent(e, now).length >= MAX_FAILURES_PER_EMAIL || recent(i, now).length >= MAX_FAILURES_PER_IP;
  const counts = await countHits(db, [e, i], WINDOW_MS, now);
  return counts.get(e)! >= MAX_FAILURES_PER_EMAIL || counts.get(i)! >= MAX_FAILURES_PER_IP;
}

export async function recordSignInFailure(email: string, ip: string, now = Date.now()): Promise<void> {
  const keys = [`e:${emailKey(email)}`, `i:${ip}`];
  const db = await sharedLimitDb();
  if (db) return addHits(db, keys, WINDOW_MS, now);
  for (const key of keys) failures.set(key, [...recent(key, now), now]);
}

/**
 * A generic counter: true (and counted) when one more event under `key` stays within `max` per
 * `windowMs`, false when the limit is reached.
 */
export async function takeToken(key: string, max: number, windowMs: number, now = Date.now()): Promise<boolean> {
  const db = await sharedLimitDb();
  if (db) return takeHit(db, key, max, windowMs, now);
  const list = recent(key, now, windowMs);
  if (list.length >= max) return false;
  failures.set(key, [...list, now]);
  return true;
}

/**
 * The client's address. Without TRUST_PROXY it is the socket's peer, stamped on the request by
 * the server (lib/http/client-address.ts) over whatever the client sent; forwarding headers are
 * believed only behind a proxy the operator configured.
 */
export function clientIp(headers: Headers | Record<string, unknown> | undefined): string {
  const get = (k: string) => (headers instanceof Headers ? headers.get(k) : ((headers?.[k] as string | undefined) ?? null));
  if (trustProxy()) {
    const forwarded = get('x-forwarded-for')?.split(',')[0]?.trim();
    if (forwarded) return forwarded;
  }
  return get(PEER_HEADER)?.trim() || 'unknown';
}
