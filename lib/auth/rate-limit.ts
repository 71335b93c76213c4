import 'server-only';

// A sliding one-minute window of failed sign-ins, kept in process memory: Candlewise runs as
// one process per data directory, so there is no second instance to share counts with.
const WINDOW_MS = 60_000;
export const MAX_FAILURES_PER_EMAIL = 10;
export const MAX_FAILURES_PER_IP = 100;

const g = globalThis as unknown as { __cwFailures?: Map<string, number[]> };
const failures: Map<string, number[]> = (g.__cwFailures ??= new Map());

function recent(key: string, now: number) {
  const list = (failures.get(key) ?? []).filter((t) => now - t < WINDOW_MS);
  if (list.length) failures.set(key, list);
  else failures.delete(key);
  return list;
}

export function isSignInBlocked(email: string, ip: string, now = Date.now()) {
  return recent(`e:${email}`, now).length >= MAX_FAILURES_PER_EMAIL || recent(`i:${ip}`, now).length >= MAX_FAILURES_PER_IP;
}

export function recordSignInFailure(email: string, ip: string, now = Date.now()) {
  for (const key of [`e:${email}`, `i:${ip}`]) failures.set(key, [...recent(key, now), now]);
}

export function clientIp(headers: Headers | Record<string, unknown> | undefined): string {
  const get = (k: string) =>
    headers instanceof Headers ? headers.get(k) : (headers?.[k] as string | undefined) ?? null;
  return (get('x-forwarded-for')?.split(',')[0] ?? get('x-real-ip') ?? 'local').trim();
}
