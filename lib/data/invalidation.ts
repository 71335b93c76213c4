import 'server-only';
import { randomUUID } from 'node:crypto';
import { sql } from 'drizzle-orm';
import { getDbHandle } from '@/db/client';
import type { DbHandle } from '@/db/open';
import { invalidate, setAccountCacheShared } from '@/lib/auth/token-cache';
import { invalidateReads } from './read-cache';

// Cache invalidation across server processes on one PostgreSQL: LISTEN/NOTIFY on one channel.
//
// Every write that makes a cached read stale (an account's role, token version or name; a species
// revision; the club settings) calls announceInvalidation() once it has committed. That drops the
// entries in this process at once and, on PostgreSQL, sends `pg_notify(candlewise_invalidate,
// {"kind","id"?,"from","n"})`. Each process's listener (startInvalidationListener, started with the
// server) drops the same entries in its own caches.
//
// When can a process trust its caches? Only while its listener hears the channel. postgres.js
// re-subscribes by itself after its listening connection drops, and calls back on every
// (re)subscription; but it says nothing when the connection goes, and a half-open TCP connection
// may go unnoticed for minutes. So the listener also sends itself a ping every HEARTBEAT_MS and
// counts itself live only while its own notifications come back within DEAD_AFTER_MS. On going
// live (first start, a reconnect, pings answered again) every cached entry is dropped, since
// notifications may have been missed meanwhile; while not live the account cache keeps nothing
// (setAccountCacheShared) and the read cache has only its short TTL. Should a notification still
// be missed while live, the TTLs bound the damage (token-cache.ts ACCOUNT_TTL_MS, read-cache.ts).
//
// A writer also waits (at most ECHO_WAIT_MS) for its own notification to come back before it
// answers: PostgreSQL hands a notification to every listening session at the same commit, so by
// then the other processes' listeners have been sent it too, and a request the client makes next
// to another process finds its cache already dropped.
//
// PGlite: one process per data directory, nothing to tell; announceInvalidation only drops this
// process's entries, exactly as before.

export const INVALIDATION_CHANNEL = 'candlewise_invalidate';

export type Invalidation =
  /** An account's session columns changed; without id, any account may have. */
  | { kind: 'account'; id?: string }
  /** A species revision was written or published. */
  | { kind: 'species' }
  /** The club settings changed. */
  | { kind: 'settings' };

type Wire = (Invalidation | { kind: 'ping' }) & { from: string; n: number };

const HEARTBEAT_MS = 1_000;
const DEAD_AFTER_MS = 3_000;
const ECHO_WAIT_MS = 1_000;
const RETRY_MS = 2_000;

export type ListenerState = 'off' | 'connecting' | 'live' | 'down';

interface Listener {
  /** This listener's own tag, so it knows its notifications when they come back. */
  from: string;
  n: number;
  state: ListenerState;
  lastEcho: number;
  echoes: Map<number, () => void>;
  onLive: Set<() => void>;
  timer: ReturnType<typeof setInterval> | null;
  unlisten: (() => Promise<void>) | null;
  stopped: boolean;
}

const g = globalThis as unknown as { __cwListeners?: WeakMap<object, Listener> };
const listeners: WeakMap<object, Listener> = (g.__cwListeners ??= new WeakMap());

function apply(msg: Invalidation) {
  if (msg.kind === 'account') invalidate(msg.id);
  else invalidateReads(msg.kind);
}

function dropEverything() {
  invalidate();
  invalidateReads('species');
  invalidateReads('settings');
}

function parse(payload: string): Wire | null {
  try {
    const m = JSON.parse(payload) as Partial<Wire> & { id?: unknown };
    if (typeof m.from !== 'string' || typeof m.n !== 'number') return null;
    if (m.kind === 'account') return { kind: 'account', id: typeof m.id === 'string' ? m.id : undefined, from: m.from, n: m.n };
    if (m.kind === 'species' || m.kind === 'settings' || m.kind === 'ping') return { kind: m.kind, from: m.from, n: m.n };
  } catch {
    /* not ours */
  }
  return null;
}

function setState(handle: DbHandle, l: Listener, state: ListenerState) {
  if (l.state === state) return;
  const wasLive = l.state === 'live';
  l.state = state;
  if (state === 'live') {
    // Whatever was cached before may have missed a notification.
    dropEverything();
    setAccountCacheShared(handle.db, true);
    l.lastEcho = performance.now();
    for (const f of l.onLive) f();
    l.onLive.clear();
  } else {
    setAccountCacheShared(handle.db, false);
    if (wasLive) dropEverything();
    if (wasLive && state === 'down') {
      console.error('[candlewise] invalidation listener down: caches are not shared until it hears the channel again');
    }
  }
}

async function send(handle: DbHandle, payload: string) {
  await handle.db.execute(sql`select pg_notify(${INVALIDATION_CHANNEL}, ${payload})`);
}

/**
 * After a committed write: drop the stale entries here and, on PostgreSQL, in every other process
 * (resolves once this process's listener has heard its own notification, or after ECHO_WAIT_MS).
 * A failed notification is logged, never thrown: the write has committed, and the TTLs cover it.
 */
export async function announceInvalidation(msg: Invalidation, handle?: DbHandle): Promise<void> {
  apply(msg);
  const h = handle ?? (await getDbHandle());
  if (h.kind !== 'postgres') return;
  const l = listeners.get(h.db);
  const n = l ? ++l.n : 0;
  const echoed = l?.state === 'live' ? echo(l, n) : null;
  try {
    await notifyInvalidation(h, msg, { from: l?.from ?? 'writer', n });
  } catch (e) {
    console.error('[candlewise] invalidation not sent', e instanceof Error ? e.message : e);
    return;
  }
  await echoed;
}

function echo(l: Listener, n: number): Promise<void> {
  return new Promise((resolve) => {
    const t = setTimeout(() => {
      l.echoes.delete(n);
      resolve();
    }, ECHO_WAIT_MS);
    t.unref?.();
    l.echoes.set(n, () => {
      clearTimeout(t);
      resolve();
    });
  });
}

/**
 * Send an invalidation on the channel only (no local effect). Writers use announceInvalidation;
 * this is the wire itself, for tests that play another process.
 */
export async function notifyInvalidation(handle: DbHandle, msg: Invalidation, tag: { from: string; n: number } = { from: 'writer', n: 0 }) {
  await send(handle, JSON.stringify({ ...msg, ...tag }));
}

/**
 * Start this process's listener on `handle` (PostgreSQL only; once per handle). Returns at once;
 * waitForInvalidationListener() waits until it is live. Stops when the handle is closed.
 */
export function startInvalidationListener(handle: DbHandle): void {
  const client = handle.postgres;
  if (handle.kind !== 'postgres' || !client || listeners.has(handle.db)) return;
  const l: Listener = {
    from: randomUUID(),
    n: 0,
    state: 'connecting',
    lastEcho: 0,
    echoes: new Map(),
    onLive: new Set(),
    timer: null,
    unlisten: null,
    stopped: false,
  };
  listeners.set(handle.db, l);

  const onNotify = (payload: string) => {
    const m = parse(payload);
    if (!m) return;
    if (m.from === l.from) {
      l.lastEcho = performance.now();
      if (l.state !== 'live') setState(handle, l, 'live');
      l.echoes.get(m.n)?.();
      l.echoes.delete(m.n);
      return;
    }
    if (m.kind !== 'ping') apply(m);
  };
  // Called on the first subscription and after every reconnect: from here on nothing is missed.
  const onListen = () => {
    if (l.stopped) return;
    if (l.state === 'live') dropEverything();
    else setState(handle, l, 'live');
  };

  const subscribe = () => {
    client.listen(INVALIDATION_CHANNEL, onNotify, onListen).then(
      (r) => {
        if (l.stopped) void r.unlisten().catch(() => {});
        else l.unlisten = r.unlisten;
      },
      (e: unknown) => {
        if (l.stopped) return;
        setState(handle, l, 'down');
        console.error('[candlewise] invalidation listener could not subscribe; retrying', e instanceof Error ? e.message : e);
        setTimeout(subscribe, RETRY_MS).unref?.();
      },
    );
  };
  subscribe();

  l.timer = setInterval(() => {
    if (l.stopped) return;
    if (l.state === 'live' && performance.now() - l.lastEcho > DEAD_AFTER_MS) setState(handle, l, 'down');
    send(handle, JSON.stringify({ kind: 'ping', from: l.from, n: ++l.n })).catch(() => {
      if (l.state === 'live') setState(handle, l, 'down');
    });
  }, HEARTBEAT_MS);
  l.timer.unref?.();

  const close = handle.close;
  handle.close = async () => {
    await stopInvalidationListener(handle);
    await close();
  };
}

/** Stop the listener on `handle`; its caches are no longer shared. */
export async function stopInvalidationListener(handle: DbHandle): Promise<void> {
  const l = listeners.get(handle.db);
  if (!l || l.stopped) return;
  l.stopped = true;
  if (l.timer) clearInterval(l.timer);
  setState(handle, l, 'off');
  for (const resolve of l.echoes.values()) resolve();
  l.echoes.clear();
  await l.unlisten?.().catch(() => {});
}

/** The listener's state on `handle`: 'off' on PGlite or before it starts. */
export function invalidationListenerState(handle: DbHandle): ListenerState {
  return listeners.get(handle.db)?.state ?? 'off';
}

/** Resolves once the listener on `handle` is live; rejects after `timeoutMs`. */
export function waitForInvalidationListener(handle: DbHandle, timeoutMs = 10_000): Promise<void> {
  const l = listeners.get(handle.db);
  if (!l) return Promise.reject(new Error('No invalidation listener was started on this database handle.'));
  if (l.state === 'live') return Promise.resolve();
  return new Promise((resolve, reject) => {
    const done = () => {
      clearTimeout(t);
      resolve();
    };
    const t = setTimeout(() => {
      l.onLive.delete(done);
      reject(new Error(`The invalidation listener was not live within ${timeoutMs} ms (state: ${l.state}).`));
    }, timeoutMs);
    l.onLive.add(done);
  });
}
