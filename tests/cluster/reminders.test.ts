import { beforeAll, describe, expect, it } from 'vitest';
import { signedIn, type Client, type SentMail } from '../support/http-client';
import { Fixtures } from '../integration/security/fixtures';
import { A, B, newTree, sameBrowserOn } from './helpers';

// Both processes run the job queue's worker on the one database. A reminder run for the same week
// queued through A and through B at the same moment sends each member's message once: the queue's
// locking and the one-reminder-per-member-and-week rule hold across processes.
// The demo member has reminders on and a Scots pine whose candle work falls in May; a few more
// members with a Scots pine each give the two workers several member jobs to share.
const WEEK = '2027-05-24'; // a Monday, used by no other test of this suite
const SUBJECT = '24 May 2027';

let adminA: Client;
let adminB: Client;
const members = ['member@candlewise.test'];

async function finished(admin: Client, runId: string) {
  for (let i = 0; i < 600; i++) {
    const r = await admin.json(`/api/admin/reminders/runs/${runId}`, 'GET');
    expect(r.status).toBe(200);
    if (r.body.run.finished) return r.body.run;
    await new Promise((res) => setTimeout(res, 100));
  }
  throw new Error(`run ${runId} did not finish within 60 s`);
}

async function remindersOfTheWeek(): Promise<SentMail[]> {
  const r = await adminA.json<{ items: SentMail[] }>('/api/outbox?limit=200', 'GET');
  expect(r.status).toBe(200);
  return r.body.items.filter((m) => m.subject.includes('your trees in the week of') && m.subject.includes(SUBJECT));
}

beforeAll(async () => {
  adminA = await signedIn(A, 'admin@candlewise.test');
  adminB = sameBrowserOn(adminA, B);
  const f = new Fixtures(A);
  for (let i = 0; i < 4; i++) {
    const acc = await f.newMember(`remind-${i}`);
    await newTree(acc.client, `Reminder Scots ${i}`, 'pinus-sylvestris');
    expect((await acc.client.json('/api/me', 'PATCH', { reminderOptIn: true })).status).toBe(200);
    members.push(acc.email);
  }
});

describe('a reminder run queued on both processes', () => {
  it('sends each member’s message once', async () => {
    expect(await remindersOfTheWeek()).toHaveLength(0);
    const [ra, rb] = await Promise.all([
      adminA.json('/api/admin/reminders/run', 'POST', { weekOf: WEEK }),
      adminB.json('/api/admin/reminders/run', 'POST', { weekOf: WEEK }),
    ]);
    expect(ra.status).toBe(202);
    expect(rb.status).toBe(202);
    // Each process may see the other's run: read A's run through B and B's through A.
    const [runA, runB] = await Promise.all([finished(adminB, ra.body.run.id), finished(adminA, rb.body.run.id)]);
    for (const run of [runA, runB]) {
      expect(run.weekOf).toBe(WEEK);
      expect(run.failed).toBe(0);
      expect(run.sent + run.skipped + run.failed).toBe(run.total);
    }

    const mails = await remindersOfTheWeek();
    const recipients = mails.flatMap((m) => m.to);
    for (const email of members) expect(recipients).toContain(email);
    // Nobody twice, and the two runs together sent exactly what arrived.
    expect(new Set(recipients).size).toBe(recipients.length);
    expect(runA.sent + runB.sent).toBe(mails.length);

    // A third run, through B again, finds everything sent.
    const again = await adminB.json('/api/admin/reminders/run', 'POST', { weekOf: WEEK });
    expect(again.status).toBe(202);
    const runC = await finished(adminA, again.body.run.id);
    expect(runC.sent).toBe(0);
    expect(await remindersOfTheWeek()).toHaveLength(mails.length);
  });
});
