import 'server-only';
import { sql } from 'drizzle-orm';
import { getDbHandle } from '@/db/client';
import type { Db } from '@/db/open';

// The limiter's counts in PostgreSQL, for several server processes on one database
// (lib/auth/rate-limit.ts decides when they are used).
//
// Each key is counted in fixed windows of its own length, numbered from the Unix epoch so every
// process agrees on where a window starts. A count is read as a sliding window: this window's hits
// plus the previous window's, weighted by how much of it still lies within the last `windowMs`
// (10 hits in the previous minute, a quarter of the way into this one, weigh 7.5). Raising a count
// is one INSERT … ON CONFLICT DO UPDATE, so two processes counting the same key at the same moment
// both land: the second waits on the row the first locked and adds to what it committed.
//
// Rows live for two windows (the current one and the one after, where they are the "previous"
// window); older ones are deleted now and then by whichever process is writing.

const PRUNE_EVERY_MS = 60_000;
const g = globalThis as unknown as { __cwRateLimitPrunedAt?: number };

const rowsOf = (r: unknown): Record<string, unknown>[] => (Array.isArray(r) ? r : ((r as { rows?: Record<string, unknown>[] }).rows ?? []));

function windows(windowMs: number, now: number) {
  const start = Math.floor(now / windowMs) * windowMs;
  return {
    current: new Date(start).toISOString(),
    previous: new Date(start - windowMs).toISOString(),
    expires: new Date(start + 2 * windowMs).toISOString(),
    /** The share of the previous window that still lies within the last `windowMs`. */
    previousWeight: 1 - (now - start) / windowMs,
  };
}

/** The sliding count of each key (all counted in windows of `windowMs`). */
export async function countHits(db: Db, keys: string[], windowMs: number, now: number): Promise<Map<string, number>> {
  const w = windows(windowMs, now);
  const rows = rowsOf(
    await db.execute(sql`
      select key, (window_start = ${w.current}::timestamptz) as current, hits
      from rate_limits
      where key in (${sql.join(
        keys.map((k) => sql`${k}`),
        sql`, `,
      )}) and window_start in (${w.current}::timestamptz, ${w.previous}::timestamptz)`),
  );
  const out = new Map(keys.map((k) => [k, 0]));
  for (const r of rows) {
    const k = String(r.key);
    const current = r.current === true || r.current === 't';
    out.set(k, (out.get(k) ?? 0) + Number(r.hits) * (current ? 1 : w.previousWeight));
  }
  return out;
}

/** Count one event under each key, whatever the counts are. */
export async function addHits(db: Db, keys: string[], windowMs: number, now: number): Promise<void> {
  const w = windows(windowMs, now);
  await db.execute(sql`
    insert into rate_limits as r (key, window_start, hits, expires_at)
    values ${sql.join(
      keys.map((k) => sql`(${k}, ${w.current}::timestamptz, 1, ${w.expires}::timestamptz)`),
      sql`, `,
    )}
    on conflict (key, window_start) do update set hits = r.hits + 1`);
  prune(db, now);
}

/**
 * Count one event under `key` if the sliding count stays within `max` with it: true when counted,
 * false (and not counted) when the limit is reached. One statement, so concurrent takers across
 * processes never overshoot.
 */
export async function takeHit(db: Db, key: string, max: number, windowMs: number, now: number): Promise<boolean> {
  const w = windows(windowMs, now);
  const previous = sql`coalesce((select p.hits from rate_limits p where p.key = ${key} and p.window_start = ${w.previous}::timestamptz), 0) * ${w.previousWeight}::float8`;
  const rows = rowsOf(
    await db.execute(sql`
      insert into rate_limits as r (key, window_start, hits, expires_at)
      select ${key}, ${w.current}::timestamptz, 1, ${w.expires}::timestamptz
      where 1 + ${previous} <= ${max}::int
      on conflict (key, window_start) do update set hits = r.hits + 1
      where r.hits + 1 + ${previous} <= ${max}::int
      returning hits`),
  );
  prune(db, now);
  return rows.length > 0;
}

/** Delete rows no window needs any more; at most once a minute per process, never awaited. */
function prune(db: Db, now: number) {
  if (now - (g.__cwRateLimitPrunedAt ?? 0) < PRUNE_EVERY_MS) return;
  g.__cwRateLimitPrunedAt = now;
  pruneRateLimits(db, now).catch((e: unknown) => console.error('[candlewise] rate limit prune', e instanceof Error ? e.message : e));
}

/** Delete the rows whose windows are over. Returns how many went. */
export async function pruneRateLimits(db: Db, now = Date.now()): Promise<number> {
  const rows = rowsOf(await db.execute(sql`delete from rate_limits where expires_at < ${new Date(now).toISOString()}::timestamptz returning 1 as gone`));
  return rows.length;
}

/** The database that holds the counts: PostgreSQL's, or null on PGlite (counts stay in memory). */
export async function sharedLimitDb(): Promise<Db | null> {
  const handle = await getDbHandle();
  return handle.kind === 'postgres' ? handle.db : null;
}
