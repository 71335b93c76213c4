import { afterAll, describe, expect, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { eq, like, sql } from 'drizzle-orm';
import { killNow, startChild, type Child } from './child';
import { openDatabase } from '../../db/open';
import { outboxMessages, reminderRunMembers, reminderSends, users } from '../../db/schema';

// The job queue through real crashes: a child runs the reminder worker (and the mail fake, as the
// server does) and is killed with SIGKILL part-way through a run, again and again, then started
// once more to finish. Every member must end up with exactly one message.
const MEMBERS = 12;
const KILLS = 4;
const SMTP_PORT = '3431';
const script = path.resolve(__dirname, 'reminder-worker.ts');
const migrationsFolder = path.resolve(__dirname, '../../db/migrations');

const tmp = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-remind-crash-'));
const dir = path.join(tmp, 'pglite');
const env = {
  NODE_ENV: 'test',
  NEXTAUTH_SECRET: randomBytes(32).toString('base64url'),
  NEXTAUTH_URL: 'http://127.0.0.1:3430',
  SMTP_FAKE_PORT: SMTP_PORT,
  SMTP_URL: '',
  MAIL_FAKE: '1',
  DATABASE_URL: '',
};
const children: Child[] = [];
const spawn = (args: string[]) => {
  const c = startChild(args, env, script, ['--require', path.resolve(__dirname, 'server-only-off.js')]);
  children.push(c);
  return c;
};
afterAll(async () => {
  for (const c of children) await killNow(c);
  fs.rmSync(tmp, { recursive: true, force: true });
});

const progressOf = (c: Child) => Math.max(-1, ...c.lines.filter((l) => l.startsWith('progress ')).map((l) => Number(l.slice(9))));

describe('reminders through SIGKILL', () => {
  it(`a run killed ${KILLS} times mid-way still sends each of ${MEMBERS} members exactly one message`, async () => {
    const prep = spawn(['prepare', dir, String(MEMBERS), '2027-05-10']);
    expect((await prep.exited).code, prep.stderr()).toBe(0);

    let killedAfter: number[] = [];
    for (let k = 0; k < KILLS; k++) {
      const child = spawn(['work', dir, SMTP_PORT]);
      await child.waitFor('working', 60_000);
      // Kill once the run has moved on by a member or two since the last start (or at once on
      // the first start, while the run job may still be listing members).
      const before = k === 0 ? -1 : killedAfter.at(-1)!;
      const target = before + 1 + (k % 2);
      const started = Date.now();
      while (progressOf(child) < target && !child.lines.includes('finished') && Date.now() - started < 60_000) {
        await new Promise((r) => setTimeout(r, 5));
      }
      if (k > 0) await new Promise((r) => setTimeout(r, 3 + 7 * k));
      const exit = await killNow(child);
      expect(exit.signal, child.stderr()).toBe('SIGKILL');
      killedAfter = [...killedAfter, progressOf(child)];
      if (child.lines.includes('finished')) break;
    }
    // Killed before the end at least once, or the test proved nothing.
    expect(killedAfter.some((p) => p < MEMBERS)).toBe(true);

    const last = spawn(['work', dir, SMTP_PORT]);
    await last.waitFor('finished', 90_000);
    last.proc.kill('SIGTERM');
    await last.exited;

    const handle = await openDatabase({ pgliteDir: dir, migrationsFolder });
    try {
      const db = handle.db;
      const members = await db.select({ id: users.id, email: users.email }).from(users).where(like(users.email, 'crash-remind-%'));
      expect(members).toHaveLength(MEMBERS);
      for (const m of members) {
        const mails = await db
          .select({ id: outboxMessages.id, subject: outboxMessages.subject })
          .from(outboxMessages)
          .where(sql`${outboxMessages.envelopeTo} @> ${JSON.stringify([m.email])}::jsonb`);
        expect(mails, `${m.email}: messages`).toHaveLength(1);
        expect(mails[0].subject).toContain('10 May 2027');
      }
      const ledger = await db
        .select({ state: reminderSends.state })
        .from(reminderSends)
        .innerJoin(users, eq(users.id, reminderSends.userId))
        .where(like(users.email, 'crash-remind-%'));
      expect(ledger.map((l) => l.state)).toEqual(Array(MEMBERS).fill('sent'));
      const outcomes = await db
        .select({ outcome: reminderRunMembers.outcome, email: users.email })
        .from(reminderRunMembers)
        .innerJoin(users, eq(users.id, reminderRunMembers.userId));
      expect(outcomes.filter((o) => o.email.startsWith('crash-remind-')).every((o) => o.outcome === 'sent')).toBe(true);
    } finally {
      await handle.close();
    }
  });
});
