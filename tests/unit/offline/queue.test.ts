import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import 'fake-indexeddb/auto';
import { IDBFactory } from 'fake-indexeddb';
import {
  closeQueue,
  discardQueued,
  enqueueSave,
  flushQueue,
  listQueued,
  newIdempotencyKey,
  retryQueued,
  sendToServer,
  sentRecord,
  type QueuedSave,
  type SendOutcome,
} from '@/components/offline/queue';
import type { SaveAnswerWithPhoneBody } from '@/lib/validation/offline';

const body = (date: string): SaveAnswerWithPhoneBody => ({
  species: 'pinus-sylvestris',
  branching: 'tertiary',
  date,
  shoot: 'candle-extending',
  position: 'beyond-silhouette',
  health: 'average',
});

async function queue(userId: string, ...dates: string[]) {
  const keys: string[] = [];
  for (const d of dates) {
    const key = newIdempotencyKey();
    keys.push(key);
    await enqueueSave({ key, userId, body: body(d), label: { speciesName: 'Scots pine', headline: 'Shorten this candle', date: d } });
  }
  return keys;
}

/**
 * A stand-in for POST /api/answers with its Idempotency-Key contract: the first send of a key
 * makes an answer, every repeat returns that same answer. `loseReplyTo` makes the server save but
 * the reply never reach the phone, as when the signal drops mid-request.
 */
function fakeServer() {
  const answers = new Map<string, { id: string; date: string }>();
  const calls: string[] = [];
  const loseReplyTo = new Set<string>();
  const send = async (e: QueuedSave): Promise<SendOutcome> => {
    calls.push(e.key);
    let a = answers.get(e.key);
    if (!a) {
      a = { id: `ans_${answers.size + 1}`, date: e.body.date };
      answers.set(e.key, a);
    }
    if (loseReplyTo.delete(e.key)) return { kind: 'later', reason: 'Failed to fetch' };
    return { kind: 'saved', id: a.id, url: `/answers/${a.id}` };
  };
  return { answers, calls, loseReplyTo, send };
}

beforeEach(() => {
  // A fresh, empty IndexedDB for every case.
  globalThis.indexedDB = new IDBFactory();
});
afterEach(async () => {
  await closeQueue();
  vi.unstubAllGlobals();
});

describe('offline answer queue', () => {
  it('sends waiting saves oldest first, each with its own key, and remembers what each became', async () => {
    const keys = await queue('u1', '2027-05-01', '2027-05-02', '2027-05-03');
    const server = fakeServer();
    const report = await flushQueue('u1', server.send);
    expect(server.calls).toEqual(keys);
    expect(report).toMatchObject({ waiting: 0, refused: 0 });
    expect(report.sent.map((s) => s.id)).toEqual(['ans_1', 'ans_2', 'ans_3']);
    expect(await listQueued('u1')).toEqual([]);
    expect(await sentRecord(keys[1], 'u1')).toMatchObject({ id: 'ans_2', url: '/answers/ans_2' });
  });

  it('stops at a save that has to wait, so nothing behind it overtakes it, and resumes from it', async () => {
    const keys = await queue('u1', '2027-05-01', '2027-05-02', '2027-05-03');
    const server = fakeServer();
    let down = true;
    const flaky = async (e: QueuedSave): Promise<SendOutcome> => (down && e.key === keys[1] ? { kind: 'later', reason: 'No connection' } : server.send(e));
    const first = await flushQueue('u1', flaky);
    expect(first.sent.map((s) => s.key)).toEqual([keys[0]]);
    expect(first.waiting).toBe(2);
    const left = await listQueued('u1');
    expect(left.map((e) => e.key)).toEqual([keys[1], keys[2]]);
    expect(left[0].attempts).toBe(1);
    expect(left[1].attempts).toBe(0);
    down = false;
    const second = await flushQueue('u1', flaky);
    expect(second.sent.map((s) => s.key)).toEqual([keys[1], keys[2]]);
    expect(server.calls).toEqual(keys);
  });

  it('replays a save whose reply was lost with the same key, and the server keeps one answer for it', async () => {
    const keys = await queue('u1', '2027-05-01', '2027-05-02');
    const server = fakeServer();
    server.loseReplyTo.add(keys[0]);
    const first = await flushQueue('u1', server.send);
    expect(first.sent).toEqual([]);
    expect(server.answers.size).toBe(1);
    const second = await flushQueue('u1', server.send);
    expect(server.calls).toEqual([keys[0], keys[0], keys[1]]);
    expect(server.answers.size).toBe(2);
    expect(second.sent.map((s) => s.id)).toEqual(['ans_1', 'ans_2']);
  });

  it('runs one flush at a time: two calls at once send every save once', async () => {
    const keys = await queue('u1', '2027-05-01', '2027-05-02');
    const server = fakeServer();
    const [a, b] = await Promise.all([flushQueue('u1', server.send), flushQueue('u1', server.send)]);
    expect(a).toBe(b);
    expect(server.calls).toEqual(keys);
  });

  it('keeps a save the server refused, says why, goes on with the next, and sends it again only when asked', async () => {
    const keys = await queue('u1', '2027-05-01', '2027-05-02');
    const server = fakeServer();
    let refuse = true;
    const picky = async (e: QueuedSave): Promise<SendOutcome> =>
      refuse && e.key === keys[0] ? { kind: 'refused', reason: 'We have no published species with that name.' } : server.send(e);
    const first = await flushQueue('u1', picky);
    expect(first).toMatchObject({ waiting: 0, refused: 1 });
    expect(first.sent.map((s) => s.key)).toEqual([keys[1]]);
    const [kept] = await listQueued('u1');
    expect(kept).toMatchObject({ key: keys[0], refused: 'We have no published species with that name.' });
    refuse = false;
    expect((await flushQueue('u1', picky)).sent).toEqual([]);
    await retryQueued(keys[0], 'u1');
    expect((await flushQueue('u1', picky)).sent.map((s) => s.key)).toEqual([keys[0]]);
    await queue('u1', '2027-05-04');
    const [another] = await listQueued('u1');
    await discardQueued(another.key, 'u1');
    expect(await listQueued('u1')).toEqual([]);
  });

  it("never sends or lists another member's saves", async () => {
    await queue('u1', '2027-05-01');
    const theirs = await queue('u2', '2027-05-02');
    const server = fakeServer();
    await flushQueue('u1', server.send);
    expect(server.calls).not.toContain(theirs[0]);
    expect((await listQueued('u2')).map((e) => e.key)).toEqual(theirs);
    await discardQueued(theirs[0], 'u1');
    expect(await listQueued('u2')).toHaveLength(1);
    await flushQueue('u2', server.send);
    expect(await sentRecord(theirs[0], 'u1')).toBeNull();
    expect(await sentRecord(theirs[0], 'u2')).toMatchObject({ id: 'ans_2' });
  });

  it('queues a key once, however often it is queued', async () => {
    const key = newIdempotencyKey();
    expect(key).toMatch(/^[A-Za-z0-9_-]{16,100}$/);
    for (let i = 0; i < 3; i++)
      await enqueueSave({ key, userId: 'u1', body: body('2027-05-01'), label: { speciesName: 'Scots pine', headline: '', date: '2027-05-01' } });
    expect(await listQueued('u1')).toHaveLength(1);
  });
});

describe('sending one save to the server', () => {
  const entry: QueuedSave = {
    seq: 1,
    key: 'k'.repeat(32),
    userId: 'u1',
    body: body('2027-05-01'),
    label: { speciesName: 'Scots pine', headline: '', date: '2027-05-01' },
    queuedAt: '2027-05-01T10:00:00Z',
    attempts: 0,
  };
  const reply = (status: number, json: unknown) =>
    vi.fn(async () => new Response(JSON.stringify(json), { status, headers: { 'content-type': 'application/json' } }));

  it('posts the body with its Idempotency-Key and takes 201 and 200 as saved', async () => {
    for (const status of [201, 200]) {
      const f = reply(status, { id: 'ans_9', url: '/answers/ans_9' });
      vi.stubGlobal('fetch', f);
      expect(await sendToServer(entry)).toEqual({ kind: 'saved', id: 'ans_9', url: '/answers/ans_9' });
      const [url, init] = f.mock.calls[0] as unknown as [string, RequestInit];
      expect(url).toBe('/api/answers');
      expect((init.headers as Record<string, string>)['Idempotency-Key']).toBe(entry.key);
      expect(JSON.parse(init.body as string)).toEqual(entry.body);
    }
  });

  it('waits on no connection, a lapsed session, a limit or a server fault; is refused on a bad body', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(async () => {
        throw new TypeError('Failed to fetch');
      }),
    );
    expect((await sendToServer(entry)).kind).toBe('later');
    for (const status of [401, 408, 429, 500, 503]) {
      vi.stubGlobal('fetch', reply(status, { error: { code: 'x', message: 'not now' } }));
      expect(await sendToServer(entry)).toEqual({ kind: 'later', reason: 'not now' });
    }
    for (const status of [400, 404, 422]) {
      vi.stubGlobal('fetch', reply(status, { error: { code: 'x', message: 'Say where the shoot is against the silhouette.' } }));
      expect(await sendToServer(entry)).toEqual({ kind: 'refused', reason: 'Say where the shoot is against the silhouette.' });
    }
  });
});
