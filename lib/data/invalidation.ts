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
// revision; the club settings; a temperature record) calls announceInvalidation() once it has committed. That drops the
// entries in this process at once and, on PostgreSQL, sends `pg_notify(candlewise_invalidate,
// {"kind","id"?,"from","n"})`. Each process's listener (startInvalidationListener, started with the
// server) drops the same entries in its own caches.
//
// When can a process trust its caches? Only while its listener hears the channel. postgres.js
// re-subscribes by itself after its listening connection drops, and calls back on every
// (re)subscription; but it says nothing when the connection goes, and a half-open TCP connection
// may go unnoticed for minutes. So the listener also pings the channel every HEARTBEAT_MS and
// counts itself live only while its own notifications come back within DEAD_AFTER_MS. On going
// live (first start, a reconnect, pings answered again) every cached entry is dropped, since
// notifications may have been missed meanwhile; while not live the account cache keeps nothing
// (setAccountCacheShared) and the read cache has only its short TTL. Should a notification still
// be missed while live, the TTLs bound the damage (token-cache.ts ACCOUNT_TTL_MS, read-cache.ts).
//
// A notification reaches each listening process on its own schedule, so a writer waits (at most
// ACK_WAIT_MS) before it answers: for its own notification to come back, and for an
// acknowledgement from every other live process it knows of (the pings say who is there and
// whether its listener is live). By the time a role change or a sign-out has been answered, every
// other live process has dropped its copy, and the very next request there reads the account
// afresh. A process that has just started learns of the others from their pings:
// waitForInvalidationListener() resolves once it has listened for a full heartbeat.
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
  | { kind: 'settings' }
  /** A temperature record (the club's or a member's) was imported. */
  | { kind: 'temperatures' };

type Control =
  /** I am here, and whether my listener is live. */
  | { kind: 'ping'; live: boolean }
  /** I have applied notification `of` from `to`. */
  | { kind: 'ack'; to: string; of: number }
  /** I am stopping: wait for me no more. */
  | { kind: 'bye' };
type Wire = (Invalidation | Control) & { from: string; n: number };

const HEARTBEAT_MS = 1_000;
const DEAD_AFTER_MS = 3_000;
const ACK_WAIT_MS = 1_000;
const RETRY_MS = 2_000;
/** The tag of a writer without a listener of its own (a script): nobody acknowledges to it. */
const ANONYMOUS = 'writer';

export type ListenerState = 'off' | 'connecting' | 'live' | 'down';

interface Listener {
  /** This listener's own tag, so it knows its notifications when they come back. */
  from: string;
  n: number;
  state: ListenerState;
  lastEcho: number;
  /** When the listener last went live (learning who else is there takes one heartbeat). */
  liveSince: number;
  /** The other processes on this database whose listeners are live: when each was last heard. */
  peers: Map<string, number>;
  /** Announcements still waiting for their echo and acknowledgements, by number. */
  pending: Map<number, { waiting: Set<string>; done: () => void }>;
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
  invalidateReads('temperatures');
}

function parse(payload: string): Wire | null {
  try {
    const m = JSON.parse(payload) as Record<string, unknown>;
    const { from, n } = m;
    if (typeof from !== 'string' || typeof n !== 'number') return null;
    switch (m.kind) {
      case 'account':
        return { kind: 'account', id: typeof m.id === 'string' ? m.id : undefined, from, n };
      case 'species':
      case 'settings':
      case 'temperatures':
      case 'bye':
        return { kind: m.kind, from, n };
      case 'ping':
        return { kind: 'ping', live: m.live === true, from, n };
      case 'ack':
        return typeof m.to === 'string' && typeof m.of === 'number' ? { kind: 'ack', to: m.to, of: m.of, from, n } : null;
    }
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
    l.lastEcho = l.liveSince = performance.now();
    return;
  }
  setAccountCacheShared(handle.db, false);
  if (wasLive) dropEverything();
  if (wasLive && state === 'down') console.error('[candlewise] invalidation listener down: caches are not shared until it hears the channel again');
}

async function send(handle: DbHandle, wire: Wire) {
  await handle.db.execute(sql`select pg_notify(${INVALIDATION_CHANNEL}, ${JSON.stringify(wire)})`);
}

/**
 * After a committed write: drop the stale entries here and, on PostgreSQL, in every other process.
 * Resolves once this process's listener has heard its own notification and every other live
 * process has acknowledged it, or after ACK_WAIT_MS. A failed notification is logged, never
 * thrown: the write has committed, and the TTLs cover it.
 */
export async function announceInvalidation(msg: Invalidation, handle?: DbHandle): Promise<void> {
  apply(msg);
  const h = handle ?? (await getDbHandle());
  if (h.kind !== 'postgres') return;
  const l = listeners.get(h.db);
  const n = l ? ++l.n : 0;
  const heard = l?.state === 'live' ? acknowledged(l, n) : null;
  try {
    await notifyInvalidation(h, msg, { from: l?.from ?? ANONYMOUS, n });
  } catch (e) {
    l?.pending.get(n)?.done();
    console.error('[candlewise] invalidation not sent', e instanceof Error ? e.message : e);
    return;
  }
  await heard;
}

/** Waits for the echo of announcement `n` and an acknowledgement from each live peer. */
function acknowledged(l: Listener, n: number): Promise<void> {
  const now = performance.now();
  const waiting = new Set([l.from]);
  for (const [peer, seen] of l.peers) if (now - seen <= DEAD_AFTER_MS) waiting.add(peer);
  return new Promise((resolve) => {
    const done = () => {
      clearTimeout(t);
      l.pending.delete(n);
      resolve();
    };
    const t = setTimeout(done, ACK_WAIT_MS);
    t.unref?.();
    l.pending.set(n, { waiting, done });
  });
}

function heardFrom(l: Listener, of: number, who: string) {
  const p = l.pending.get(of);
  if (!p) return;
  p.waiting.delete(who);
  if (p.waiting.size === 0) p.done();
}

/**
 * Send an invalidation on the channel only (no local effect). Writers use announceInvalidation;
 * this is the wire itself, for tests that play another process.
 */
export async function notifyInvalidation(handle: DbHandle, msg: Invalidation, tag: { from: string; n: number } = { from: ANONYMOUS, n: 0 }) {
  await send(handle, { ...msg, ...tag });
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
    liveSince: 0,
    peers: new Map(),
    pending: new Map(),
    timer: null,
    unlisten: null,
    stopped: false,
  };
  listeners.set(handle.db, l);
  const tell = (m: Control) => send(handle, { ...m, from: l.from, n: ++l.n });

  const onNotify = (payload: string) => {
    const m = parse(payload);
    if (!m || l.stopped) return;
    if (m.from === l.from) {
      l.lastEcho = performance.now();
      if (l.state !== 'live') setState(handle, l, 'live');
      heardFrom(l, m.n, l.from);
      return;
    }
    switch (m.kind) {
      case 'ping':
        if (m.live) l.peers.set(m.from, performance.now());
        else l.peers.delete(m.from);
        return;
      case 'bye':
        l.peers.delete(m.from);
        for (const of of [...l.pending.keys()]) heardFrom(l, of, m.from);
        return;
      case 'ack':
        if (m.to === l.from) heardFrom(l, m.of, m.from);
        return;
      default:
        apply(m);
        if (l.state === 'live' && m.from !== ANONYMOUS) tell({ kind: 'ack', to: m.from, of: m.n }).catch(() => {});
    }
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
    tell({ kind: 'ping', live: l.state === 'live' }).catch(() => {
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

/** Stop the listener on `handle`: its caches are no longer shared, and the others stop waiting for it. */
export async function stopInvalidationListener(handle: DbHandle): Promise<void> {
  const l = listeners.get(handle.db);
  if (!l || l.stopped) return;
  l.stopped = true;
  if (l.timer) clearInterval(l.timer);
  setState(handle, l, 'off');
  for (const p of [...l.pending.values()]) p.done();
  await send(handle, { kind: 'bye', from: l.from, n: ++l.n }).catch(() => {});
  await l.unlisten?.().catch(() => {});
}

/**
 * The listener's state on `handle`: 'off' on PGlite or before it starts; 'live' once it hears the
 * channel and has heard the other processes for a full heartbeat ('connecting' until then).
 */
export function invalidationListenerState(handle: DbHandle): ListenerState {
  const l = listeners.get(handle.db);
  if (!l) return 'off';
  return l.state === 'live' && !knowsPeers(l) ? 'connecting' : l.state;
}

const knowsPeers = (l: Listener) => performance.now() - l.liveSince >= HEARTBEAT_MS * 1.2;

/**
 * Resolves once the listener on `handle` is live and has listened for a full heartbeat (so it
 * knows the other live processes, and waits for them when it writes); rejects after `timeoutMs`.
 */
export async function waitForInvalidationListener(handle: DbHandle, timeoutMs = 10_000): Promise<void> {
  const l = listeners.get(handle.db);
  if (!l) throw new Error('No invalidation listener was started on this database handle.');
  const deadline = performance.now() + timeoutMs;
  for (;;) {
    const now = performance.now();
    if (l.state === 'live' && knowsPeers(l)) return;
    if (now >= deadline) throw new Error(`The invalidation listener was not ready within ${timeoutMs} ms (state: ${l.state}).`);
    await new Promise((r) => setTimeout(r, Math.min(50, deadline - now)));
  }
}
