import { openDB, type DBSchema, type IDBPDatabase } from 'idb';
import type { SaveAnswerWithPhoneBody } from '@/lib/validation/offline';
import { markReachable, markUnreachable } from './connectivity';

// Answers saved with no signal wait here, in IndexedDB, until the connection returns. Each keeps
// the Idempotency-Key it was given when it was queued, so sending it again (a retry, a second tab,
// a reload half-way through) finds the answer the first send made instead of saving a second one.
// They are sent oldest first; one that cannot be sent yet holds back the ones behind it.

export interface QueuedSave {
  /** Order of queueing; IndexedDB numbers these. */
  seq?: number;
  /** The Idempotency-Key sent with every attempt. */
  key: string;
  /** Only the member who queued it sends it or sees it. */
  userId: string;
  body: SaveAnswerWithPhoneBody;
  /** What the list shows while it waits. */
  label: { speciesName: string; headline: string; date: string };
  queuedAt: string;
  attempts: number;
  /** Set when the server refused it (not a network problem): kept, shown, not retried by itself. */
  refused?: string;
}

export interface SentSave {
  key: string;
  userId: string;
  id: string;
  url: string;
  sentAt: string;
}

interface QueueDb extends DBSchema {
  saves: { key: number; value: QueuedSave; indexes: { 'by-key': string; 'by-user': string } };
  sent: { key: string; value: SentSave; indexes: { 'by-user': string } };
}

const DB_NAME = 'candlewise-offline';
/** How many sent records are kept so a save panel can still link to what its answer became. */
const SENT_KEPT = 50;

let dbPromise: Promise<IDBPDatabase<QueueDb>> | null = null;

function db(): Promise<IDBPDatabase<QueueDb>> {
  dbPromise ??= openDB<QueueDb>(DB_NAME, 1, {
    upgrade(d) {
      const saves = d.createObjectStore('saves', { keyPath: 'seq', autoIncrement: true });
      saves.createIndex('by-key', 'key', { unique: true });
      saves.createIndex('by-user', 'userId');
      const sent = d.createObjectStore('sent', { keyPath: 'key' });
      sent.createIndex('by-user', 'userId');
    },
  });
  return dbPromise;
}

/** Closes the database (tests open a fresh one per case). */
export async function closeQueue(): Promise<void> {
  if (dbPromise) (await dbPromise).close();
  dbPromise = null;
}

// ---- change notices, so every list on the page shows the same count ----

const listeners = new Set<() => void>();
let channel: BroadcastChannel | null = null;

function notify() {
  for (const l of listeners) l();
  channel?.postMessage('changed');
}

export function subscribeQueue(cb: () => void): () => void {
  if (!channel && typeof BroadcastChannel !== 'undefined') {
    channel = new BroadcastChannel('candlewise-queue');
    channel.onmessage = () => listeners.forEach((l) => l());
  }
  listeners.add(cb);
  return () => listeners.delete(cb);
}

/** A fresh key for one save: 32 url-safe characters from the platform's random source. */
export function newIdempotencyKey(): string {
  return crypto.randomUUID().replace(/-/g, '');
}

/** Put a save at the back of the queue. Queueing the same key twice keeps the first. */
export async function enqueueSave(entry: Omit<QueuedSave, 'seq' | 'attempts' | 'queuedAt'> & { queuedAt?: string }): Promise<QueuedSave> {
  const d = await db();
  const tx = d.transaction('saves', 'readwrite');
  const existing = await tx.store.index('by-key').get(entry.key);
  if (existing) {
    await tx.done;
    return existing;
  }
  const value: QueuedSave = { ...entry, queuedAt: entry.queuedAt ?? new Date().toISOString(), attempts: 0 };
  value.seq = await tx.store.add(value);
  await tx.done;
  notify();
  return value;
}

/** This member's waiting saves, oldest first. */
export async function listQueued(userId: string): Promise<QueuedSave[]> {
  const d = await db();
  const all = await d.getAllFromIndex('saves', 'by-user', userId);
  return all.sort((a, b) => a.seq! - b.seq!);
}

/** What a sent save became, by its key; null while it waits (or for another member). */
export async function sentRecord(key: string, userId: string): Promise<SentSave | null> {
  const d = await db();
  const r = await d.get('sent', key);
  return r && r.userId === userId ? r : null;
}

/** Drops a save the member gives up on (only one the server refused is offered for this). */
export async function discardQueued(key: string, userId: string): Promise<void> {
  const d = await db();
  const tx = d.transaction('saves', 'readwrite');
  const e = await tx.store.index('by-key').get(key);
  if (e && e.userId === userId) await tx.store.delete(e.seq!);
  await tx.done;
  notify();
}

/** Puts a refused save back in line, to be sent with the next flush. */
export async function retryQueued(key: string, userId: string): Promise<void> {
  const d = await db();
  const tx = d.transaction('saves', 'readwrite');
  const e = await tx.store.index('by-key').get(key);
  if (e && e.userId === userId) await tx.store.put({ ...e, refused: undefined });
  await tx.done;
  notify();
}

export type SendOutcome =
  | { kind: 'saved'; id: string; url: string }
  /** No connection, a timeout, a server fault or a limit: try again later, and keep the order. */
  | { kind: 'later'; reason: string }
  /** The server will not take it as it is: keep it, say why, go on with the next. */
  | { kind: 'refused'; reason: string };

export type Sender = (entry: QueuedSave) => Promise<SendOutcome>;

/** Sends one save to POST /api/answers with its Idempotency-Key and says what came of it. */
export const sendToServer: Sender = async (entry) => {
  let res: Response;
  try {
    res = await fetch('/api/answers', {
      method: 'POST',
      headers: { 'content-type': 'application/json', accept: 'application/json', 'Idempotency-Key': entry.key },
      body: JSON.stringify(entry.body),
      signal: AbortSignal.timeout(15_000),
    });
  } catch (e) {
    markUnreachable();
    return { kind: 'later', reason: e instanceof Error ? e.message : 'No connection' };
  }
  markReachable();
  const data = (await res.json().catch(() => null)) as { id?: string; url?: string; error?: { message?: string } } | null;
  if (res.ok && data?.id && data.url) return { kind: 'saved', id: data.id, url: data.url };
  const reason = data?.error?.message ?? `The server answered ${res.status}.`;
  // Signed out, timed out, rate-limited or a fault on the server: none of these is the answer's fault.
  if (res.status === 401 || res.status === 408 || res.status === 429 || res.status >= 500) return { kind: 'later', reason };
  return { kind: 'refused', reason };
};

let running: Promise<FlushReport> | null = null;

export interface FlushReport {
  sent: SentSave[];
  waiting: number;
  refused: number;
}

/**
 * Sends this member's waiting saves in the order they were queued. A save the server took is
 * removed and remembered as sent; one that has to wait stops the run so nothing overtakes it;
 * one the server refused stays, marked, and the run goes on. One run at a time per page, and
 * one per browser where Web Locks exist.
 */
export function flushQueue(userId: string, send: Sender = sendToServer): Promise<FlushReport> {
  if (running) return running;
  const run = async () => {
    const locks = typeof navigator !== 'undefined' ? navigator.locks : undefined;
    return locks ? locks.request('candlewise-queue', () => flushOnce(userId, send)) : flushOnce(userId, send);
  };
  running = run().finally(() => {
    running = null;
  });
  return running;
}

async function flushOnce(userId: string, send: Sender): Promise<FlushReport> {
  const sent: SentSave[] = [];
  const d = await db();
  for (const entry of await listQueued(userId)) {
    if (entry.refused) continue;
    let outcome: SendOutcome;
    try {
      outcome = await send(entry);
    } catch (e) {
      outcome = { kind: 'later', reason: e instanceof Error ? e.message : 'Could not send' };
    }
    if (outcome.kind === 'saved') {
      const record: SentSave = { key: entry.key, userId, id: outcome.id, url: outcome.url, sentAt: new Date().toISOString() };
      const tx = d.transaction(['saves', 'sent'], 'readwrite');
      await tx.objectStore('saves').delete(entry.seq!);
      await tx.objectStore('sent').put(record);
      await tx.done;
      sent.push(record);
      notify();
      continue;
    }
    await d.put('saves', { ...entry, attempts: entry.attempts + 1, ...(outcome.kind === 'refused' ? { refused: outcome.reason } : {}) });
    notify();
    if (outcome.kind === 'later') break;
  }
  await pruneSent(d);
  const left = await listQueued(userId);
  return { sent, waiting: left.filter((e) => !e.refused).length, refused: left.filter((e) => e.refused).length };
}

async function pruneSent(d: IDBPDatabase<QueueDb>) {
  const all = await d.getAll('sent');
  if (all.length <= SENT_KEPT) return;
  all.sort((a, b) => a.sentAt.localeCompare(b.sentAt));
  const tx = d.transaction('sent', 'readwrite');
  for (const r of all.slice(0, all.length - SENT_KEPT)) await tx.store.delete(r.key);
  await tx.done;
}
