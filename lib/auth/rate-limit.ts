import 'server-only';
import { PEER_HEADER, trustProxy } from '@/lib/http/client-address';

// Sliding one-minute windows kept in process memory: Candlewise runs as one process per data
// directory, so there is no second instance to share counts with.
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

export function isSignInBlocked(email: string, ip: string, now = Date.now()) {
  return recent(`e:${emailKey(email)}`, now).length >= MAX_FAILURES_PER_EMAIL || recent(`i:${ip}`, now).length >= MAX_FAILURES_PER_IP;
}

export function recordSignInFailure(email: string, ip: string, now = Date.now()) {
  for (const key of [`e:${emailKey(email)}`, `i:${ip}`]) failures.set(key, [...recent(key, now), now]);
}

/**
 * A generic counter: true (and counted) when one more event under `key` stays within `max` per
 * `windowMs`, false when the limit is reached.
 */
export function takeToken(key: string, max: number, windowMs: number, now = Date.now()): boolean {
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
