import { afterAll, beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, signedIn } from '../support/http-client';
import { Fixtures, type Account } from './security/fixtures';

const base = inject('baseUrl');

// The weekly reminders over HTTP: opt-in on the profile, a run queued with 202 and settled by the
// server's own job queue, one message per member and week, and the unsubscribe link in it.
// The demo member has reminders on and a Scots pine whose candle work falls in May.
const WEEK = '2027-05-10'; // a Monday

let member: Client;
let admin: Client;
let librarian: Client;
let bare: Account;

interface Mail {
  to: string[];
  subject: string;
  text: string | null;
}

async function outbox(): Promise<Mail[]> {
  const { body } = await admin.json('/api/outbox?limit=200', 'GET');
  return body.items;
}
// This file's week only: other files (the route matrix, the fuzzers) queue runs of their own weeks.
const remindersTo = async (email: string, week = '10 May 2027') =>
  (await outbox()).filter((m) => m.to.includes(email) && m.subject.includes('your trees in the week of') && m.subject.includes(week));

async function finished(runId: string) {
  for (let i = 0; i < 300; i++) {
    const r = await admin.json(`/api/admin/reminders/runs/${runId}`, 'GET');
    expect(r.status).toBe(200);
    if (r.body.run.finished) return r.body.run;
    await new Promise((res) => setTimeout(res, 100));
  }
  throw new Error(`run ${runId} did not finish within 30 s`);
}

beforeAll(async () => {
  member = await signedIn(base, 'member@candlewise.test');
  admin = await signedIn(base, 'admin@candlewise.test');
  librarian = await signedIn(base, 'librarian@candlewise.test');
  // A member with reminders on and no trees: nothing is ever due for them.
  bare = await new Fixtures(base).newMember('remind');
});
afterAll(async () => {
  await member.json('/api/me', 'PATCH', { reminderOptIn: true });
});

describe('reminders: the opt-in', () => {
  it('is off for a new member and follows the profile setting', async () => {
    expect((await bare.client.json('/api/me', 'GET')).body.user.reminderOptIn).toBe(false);
    const on = await bare.client.json('/api/me', 'PATCH', { reminderOptIn: true });
    expect(on.status).toBe(200);
    expect(on.body.user.reminderOptIn).toBe(true);
    expect((await bare.client.json('/api/me', 'PATCH', { reminderOptIn: 'yes' })).status).toBe(422);
    expect((await bare.client.json('/api/me', 'GET')).body.user.reminderOptIn).toBe(true);
  });
});

describe('reminders: who may run them', () => {
  it('401 for the anonymous and 403 below admin, before the body is read', async () => {
    const anon = new Client(base);
    expect((await anon.json('/api/admin/reminders/run', 'POST', { weekOf: 'not a date' })).status).toBe(401);
    for (const c of [member, librarian]) {
      expect((await c.json('/api/admin/reminders/run', 'POST', { weekOf: 'not a date' })).status).toBe(403);
      expect((await c.json('/api/admin/reminders/runs', 'GET')).status).toBe(403);
    }
    expect((await anon.json('/api/admin/reminders/runs/abcdefghijkl', 'GET')).status).toBe(401);
  });

  it('422 naming weekOf for a bad week, 404 for an unknown run', async () => {
    const bad = await admin.json('/api/admin/reminders/run', 'POST', { weekOf: '2027-13-40' });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields)).toContain('weekOf');
    expect((await admin.json('/api/admin/reminders/run', 'POST', { weekOf: WEEK, extra: 1 })).status).toBe(422);
    expect((await admin.json('/api/admin/reminders/runs/abcdefghijkl', 'GET')).status).toBe(404);
    expect((await admin.json('/api/admin/reminders/runs/bad', 'GET')).status).toBe(404); // malformed id
  });
});

describe('reminders: a run', () => {
  let token = '';

  it('answers 202 with the queued run, and the demo member’s mail reaches the outbox once', async () => {
    const before = (await remindersTo('member@candlewise.test')).length;
    // Any day of the week names its Monday.
    const r = await admin.json('/api/admin/reminders/run', 'POST', { weekOf: '2027-05-12' });
    expect(r.status).toBe(202);
    expect(r.body.run).toMatchObject({ weekOf: WEEK, sent: 0, finished: false });
    expect(r.body.run.id).toMatch(/^[A-Za-z0-9_-]{16}$/);
    expect(r.headers.get('location')).toBe(`/api/admin/reminders/runs/${r.body.run.id}`);

    const run = await finished(r.body.run.id);
    expect(run.total).toBeGreaterThanOrEqual(2);
    expect(run.sent).toBeGreaterThanOrEqual(1);
    expect(run.skipped).toBeGreaterThanOrEqual(1); // the member without trees
    expect(run.sent + run.skipped + run.failed).toBe(run.total);

    const mails = await remindersTo('member@candlewise.test');
    expect(mails.length - before).toBe(1);
    const mail = mails[0];
    expect(mail.subject).toContain('10 May 2027');
    expect(mail.text).toContain('Pinch or shorten candles');
    const trees = (await member.json('/api/trees', 'GET')).body.items as { id: string; name: string; speciesSlug: string }[];
    const scots = trees.find((t) => t.speciesSlug === 'pinus-sylvestris')!;
    expect(mail.text).toContain(scots.name);
    expect(mail.text).toContain(`/trees/${scots.id}`);
    // Nothing due, no message.
    expect(await remindersTo(bare.email)).toHaveLength(0);

    const m = /\/unsubscribe\?token=([^\s)]+)/.exec(mail.text ?? '');
    expect(m).not.toBeNull();
    token = decodeURIComponent(m![1]);
  });

  it('a second run of the same week sends nobody anything again', async () => {
    const r = await admin.json('/api/admin/reminders/run', 'POST', { weekOf: WEEK });
    expect(r.status).toBe(202);
    const run = await finished(r.body.run.id);
    expect(run.sent).toBe(0);
    expect(run.skipped).toBe(run.total);
    expect(await remindersTo('member@candlewise.test')).toHaveLength(1);
    const list = await admin.json('/api/admin/reminders/runs', 'GET');
    expect(list.body.items.slice(0, 2).map((x: { id: string }) => x.id)).toContain(r.body.run.id);
  });

  it('the link in the mail turns the reminders off, and only them', async () => {
    const anon = new Client(base);
    const r = await anon.json('/api/unsubscribe', 'POST', { token });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({ ok: true, email: 'member@candlewise.test', list: 'reminders' });
    const me = (await member.json('/api/me', 'GET')).body.user;
    expect(me.reminderOptIn).toBe(false);
    expect(me.digestOptIn).toBe(true);
    const page = await anon.get(`/unsubscribe?token=${encodeURIComponent(token)}`);
    expect(await page.text()).toContain('Stop the weekly reminders');
  });

  it('a member who turned them off is not in the next run', async () => {
    const r = await admin.json('/api/admin/reminders/run', 'POST', { weekOf: '2027-05-17' });
    const run = await finished(r.body.run.id);
    expect(await remindersTo('member@candlewise.test')).toHaveLength(1);
    const all = (await outbox()).filter((x) => x.to.includes('member@candlewise.test') && x.subject.includes('17 May 2027'));
    expect(all).toHaveLength(0);
    expect(run.total).toBeGreaterThanOrEqual(1);
  });
});
