import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import path from 'node:path';
import { eq, sql } from 'drizzle-orm';
import { openDatabase, type DbHandle } from '@/db/open';
import { setDbHandle } from '@/db/client';
import { seedSettings, seedUsers } from '@/db/seed';
import { seedSpecies } from '@/db/seed-species';
import { clubSettings, rateLimits, users } from '@/db/schema';
import { isSignInBlocked, MAX_FAILURES_PER_EMAIL, recordSignInFailure, takeToken } from '@/lib/auth/rate-limit';
import { pruneRateLimits, takeHit } from '@/lib/data/rate-limits';
import { ACCOUNT_TTL_MS, invalidate } from '@/lib/auth/token-cache';
import { findSessionAccount } from '@/lib/data/users';
import { getClubSettings } from '@/lib/data/settings';
import { getWizardSpecies } from '@/lib/data/species';
import { startChild } from '../crash/child';
import {
  announceInvalidation,
  INVALIDATION_CHANNEL,
  invalidationListenerState,
  notifyInvalidation,
  startInvalidationListener,
  stopInvalidationListener,
  waitForInvalidationListener,
} from '@/lib/data/invalidation';

// Shared state between server processes on one database. In the PostgreSQL pass
// (scripts/with-postgres.sh sets TEST_DATABASE_URL) two database handles — two postgres.js
// clients, each with its own pool and listener, as two server processes would have — share a new
// database on that server; "through A" means the process database is A's while the call runs. In
// the PGlite pass the same calls show PGlite's single process as it always was.
const serverUrl = process.env.TEST_DATABASE_URL;
const cleanups: (() => Promise<void>)[] = [];
afterAll(async () => {
  for (const c of cleanups.reverse()) await c();
});

async function newServerDatabase(url: string) {
  const { default: postgres } = await import('postgres');
  const admin = postgres(url, { max: 1, onnotice: () => {} });
  const name = `cw_shared_${process.pid}_${Date.now()}`;
  await admin.unsafe(`create database ${name}`);
  cleanups.push(async () => {
    await admin.unsafe(`drop database if exists ${name} with (force)`);
    await admin.end({ timeout: 5 });
  });
  const u = new URL(url);
  u.pathname = `/${name}`;
  return u.toString();
}

/** Polls `check` until it holds (bounded), then returns its last value. */
async function eventually<T>(read: () => Promise<T>, holds: (v: T) => boolean, timeoutMs = 10_000): Promise<T> {
  const deadline = Date.now() + timeoutMs;
  for (;;) {
    const v = await read();
    if (holds(v) || Date.now() > deadline) return v;
    await new Promise((r) => setTimeout(r, 20));
  }
}

/** Run `fn` with `h` as the process database (as if in that process). */
async function through<T>(h: DbHandle, fn: () => Promise<T>): Promise<T> {
  setDbHandle(h);
  return fn();
}

/** A time this many ms into a fresh one-minute window (so a test never straddles a boundary). */
const intoMinute = (ms: number) => Math.floor(Date.now() / 60_000) * 60_000 + ms;
let unique = 0;
const fresh = (what: string) => `${what}-${process.pid}-${Date.now()}-${++unique}`;

async function role(h: DbHandle, id: string) {
  return through(h, async () => (await findSessionAccount(id))?.role);
}

if (serverUrl) {
  describe('two server processes on one PostgreSQL database', () => {
    let a: DbHandle;
    let b: DbHandle;
    let memberId: string;
    let dbUrl: string;

    beforeAll(async () => {
      const url = (dbUrl = await newServerDatabase(serverUrl));
      a = await openDatabase({ databaseUrl: url });
      cleanups.push(() => a.close());
      b = await openDatabase({ databaseUrl: url });
      cleanups.push(() => b.close());
      await seedUsers(a.db);
      await seedSettings(a.db);
      [{ id: memberId }] = await a.db.select({ id: users.id }).from(users).where(eq(users.email, 'member@candlewise.test'));
      startInvalidationListener(a);
      startInvalidationListener(b);
      await waitForInvalidationListener(a);
      await waitForInvalidationListener(b);
    }, 60_000);

    it('locks an account after ten failures spread over both', async () => {
      const email = `${fresh('split')}@candlewise.test`;
      const now = intoMinute(20_000);
      for (let i = 0; i < MAX_FAILURES_PER_EMAIL - 1; i++) {
        await through(i % 2 ? b : a, () => recordSignInFailure(email, `10.20.0.${i}`, now + i));
      }
      // Nine so far, counted half here and half there: neither process locks yet.
      expect(await through(a, () => isSignInBlocked(email, '10.30.0.1', now + 20))).toBe(false);
      expect(await through(b, () => isSignInBlocked(email, '10.30.0.1', now + 20))).toBe(false);
      await through(b, () => recordSignInFailure(email.toUpperCase(), '10.20.0.99', now + 30));
      expect(await through(a, () => isSignInBlocked(` ${email}`, '10.30.0.1', now + 40))).toBe(true);
      expect(await through(b, () => isSignInBlocked(email, '10.30.0.2', now + 40))).toBe(true);
      // The counts are rows both processes see, not memory in either.
      const rows = await a.db
        .select({ hits: rateLimits.hits })
        .from(rateLimits)
        .where(eq(rateLimits.key, `e:${email}`));
      expect(rows.map((r) => r.hits)).toEqual([MAX_FAILURES_PER_EMAIL]);
    });

    it("counts the previous minute's failures by how much of it is still within the last minute", async () => {
      const email = `${fresh('slide')}@candlewise.test`;
      const start = intoMinute(0) - 60_000;
      for (let i = 0; i < MAX_FAILURES_PER_EMAIL; i++) await through(a, () => recordSignInFailure(email, '10.40.0.1', start + 45_000));
      expect(await through(b, () => isSignInBlocked(email, '10.40.0.2', start + 50_000))).toBe(true);
      // A tenth of the way into the next minute, nine tenths of those ten still count: 9 < 10.
      expect(await through(b, () => isSignInBlocked(email, '10.40.0.2', start + 66_000))).toBe(false);
      await through(b, () => recordSignInFailure(email, '10.40.0.2', start + 66_000));
      expect(await through(a, () => isSignInBlocked(email, '10.40.0.3', start + 66_000))).toBe(true);
    });

    it('gives a link limit of 3 exactly 3 times when 20 requests race over both', async () => {
      const key = fresh('link-e');
      const now = intoMinute(10_000);
      const results = await Promise.all(Array.from({ length: 20 }, (_, i) => takeHit(i % 2 ? b.db : a.db, key, 3, 15 * 60_000, now)));
      expect(results.filter(Boolean)).toHaveLength(3);
      // A refused request is not counted: the row says 3, not 20.
      const [row] = await b.db.select({ hits: rateLimits.hits }).from(rateLimits).where(eq(rateLimits.key, key));
      expect(row.hits).toBe(3);
      // takeToken (what the routes call) reads the same count through either process.
      expect(await through(a, () => takeToken(key, 3, 15 * 60_000, now + 1))).toBe(false);
      expect(await through(b, () => takeToken(key, 4, 15 * 60_000, now + 1))).toBe(true);
    });

    it("drops B's cached account when A announces a write, and not before", async () => {
      expect(invalidationListenerState(b)).toBe('live');
      // (Priming drops this process's copy directly: an announcement would also reach B's listener
      // a moment later, and the copy B is about to keep with it.)
      await a.db.update(users).set({ role: 'member' }).where(eq(users.id, memberId));
      invalidate(memberId);
      expect(await role(b, memberId)).toBe('member');
      // A's write, without its announcement: B keeps its copy (the cache is really in use).
      await a.db.update(users).set({ role: 'editor' }).where(eq(users.id, memberId));
      expect(await role(b, memberId)).toBe('member');
      // Now the notification only (no local effect in this test process), as another process sends it.
      await notifyInvalidation(a, { kind: 'account', id: memberId }, { from: 'process-a', n: 1 });
      expect(
        await eventually(
          () => role(b, memberId),
          (r) => r === 'editor',
        ),
      ).toBe('editor');
    });

    it("drops B's cached club settings when A notifies", async () => {
      const before = await through(b, getClubSettings);
      const renamed = fresh('Riverside Pine Study Group');
      await a.db.update(clubSettings).set({ clubName: renamed });
      expect((await through(b, getClubSettings)).clubName).toBe(before.clubName);
      await notifyInvalidation(a, { kind: 'settings' }, { from: 'process-a', n: 2 });
      expect(
        (
          await eventually(
            () => through(b, getClubSettings),
            (s) => s.clubName === renamed,
          )
        ).clubName,
      ).toBe(renamed);
    });

    it('falls back on the TTL when a notification is missed', async () => {
      await a.db.update(users).set({ name: 'Before' }).where(eq(users.id, memberId));
      invalidate(memberId);
      const name = () => through(b, async () => (await findSessionAccount(memberId))?.name);
      expect(await name()).toBe('Before');
      await a.db.update(users).set({ name: 'After' }).where(eq(users.id, memberId));
      expect(await name()).toBe('Before');
      const at = Date.now() + ACCOUNT_TTL_MS + 1;
      const clock = vi.spyOn(Date, 'now').mockReturnValue(at);
      try {
        expect(await name()).toBe('After');
      } finally {
        clock.mockRestore();
      }
    });

    it('drops every cached entry when the listening connection comes back', async () => {
      await a.db.update(users).set({ role: 'member' }).where(eq(users.id, memberId));
      invalidate(memberId);
      expect(await role(b, memberId)).toBe('member');
      await a.db.update(users).set({ role: 'librarian' }).where(eq(users.id, memberId));
      expect(await role(b, memberId)).toBe('member');
      // The server ends the listening sessions (a restart, a failover, a proxy's idle cut).
      await a.db.execute(sql`select pg_terminate_backend(pid) from pg_stat_activity where pid <> pg_backend_pid() and query ilike 'listen %'`);
      expect(
        await eventually(
          () => role(b, memberId),
          (r) => r === 'librarian',
        ),
      ).toBe('librarian');
      await waitForInvalidationListener(b);
      expect(invalidationListenerState(b)).toBe('live');
    });

    it('puts what a writer announces on the channel, as JSON naming its kind and id', async () => {
      const { default: postgres } = await import('postgres');
      const other = postgres(dbUrl, { max: 1, onnotice: () => {} });
      cleanups.push(() => other.end({ timeout: 5 }));
      const heard: unknown[] = [];
      await other.listen(INVALIDATION_CHANNEL, (p) => {
        const m = JSON.parse(p) as { kind: string };
        if (['account', 'species', 'settings'].includes(m.kind)) heard.push(m);
      });
      await through(a, () => announceInvalidation({ kind: 'species' }));
      await announceInvalidation({ kind: 'account', id: memberId }, b);
      const got = await eventually(
        async () => heard,
        (h) => h.length >= 2,
      );
      expect(got).toEqual([expect.objectContaining({ kind: 'species' }), expect.objectContaining({ kind: 'account', id: memberId })]);
    });

    it('prunes only the rows whose windows are over', async () => {
      const key = fresh('prune');
      const now = intoMinute(5_000);
      await through(a, () => takeToken(key, 5, 60_000, now - 120_000));
      await through(a, () => takeToken(key, 5, 60_000, now));
      await pruneRateLimits(a.db, now);
      const left = await a.db.select({ windowStart: rateLimits.windowStart }).from(rateLimits).where(eq(rateLimits.key, key));
      expect(left.map((r) => r.windowStart.getTime())).toEqual([intoMinute(0)]);
    });

    it('reads every account afresh while the listener is stopped', async () => {
      await stopInvalidationListener(b);
      expect(invalidationListenerState(b)).toBe('off');
      await a.db.update(users).set({ role: 'member' }).where(eq(users.id, memberId));
      expect(await role(b, memberId)).toBe('member');
      await a.db.update(users).set({ role: 'editor' }).where(eq(users.id, memberId));
      expect(await role(b, memberId)).toBe('editor');
    });
  });

  // The other process is a real one here (tests/support/other-process.ts): it writes through the
  // data layer, whose announcement must reach this process's listener before it answers.
  describe('a write made by another server process', () => {
    let b: DbHandle;
    let dbUrl: string;
    beforeAll(async () => {
      dbUrl = await newServerDatabase(serverUrl);
      b = await openDatabase({ databaseUrl: dbUrl });
      cleanups.push(() => b.close());
      await seedUsers(b.db);
      await seedSettings(b.db);
      await seedSpecies(b.db);
      startInvalidationListener(b);
      await waitForInvalidationListener(b);
      setDbHandle(b);
    }, 120_000);

    async function inOtherProcess(...args: string[]) {
      const child = startChild(args, { DATABASE_URL: dbUrl }, path.resolve(__dirname, '../support/other-process.ts'), [
        '--require',
        path.resolve(__dirname, '../crash/server-only-off.js'),
      ]);
      const { code } = await child.exited;
      expect(code, child.stderr()).toBe(0);
      expect(child.lines).toContain('done');
    }
    const account = async (email: string) => {
      const [u] = await b.db.select({ id: users.id }).from(users).where(eq(users.email, email));
      return findSessionAccount(u.id);
    };

    it('takes a role change into account on the very next read here', async () => {
      expect((await account('member2@candlewise.test'))?.role).toBe('member');
      await inOtherProcess('role', 'member2@candlewise.test', 'librarian');
      expect((await account('member2@candlewise.test'))?.role).toBe('librarian');
    }, 60_000);

    it('ends the sessions of a sign-out on the very next read here', async () => {
      const before = (await account('member@candlewise.test'))!.tokenVersion;
      expect((await account('member@candlewise.test'))!.tokenVersion).toBe(before);
      await inOtherProcess('sign-out', 'member@candlewise.test');
      expect((await account('member@candlewise.test'))!.tokenVersion).toBe(before + 1);
    }, 60_000);

    it('shows new club settings and a newly published species to the wizard here at once', async () => {
      const settingsBefore = await getClubSettings();
      const speciesBefore = (await getWizardSpecies('pinus-sylvestris'))!;
      const club = fresh('Riverside Pine Study Group');
      await inOtherProcess('settings', club);
      expect((await getClubSettings()).clubName).toBe(club);
      expect(settingsBefore.clubName).not.toBe(club);
      await inOtherProcess('publish', 'pinus-sylvestris', 'Riverside test pine');
      const after = (await getWizardSpecies('pinus-sylvestris'))!;
      expect(after.commonName).toBe('Riverside test pine');
      expect(after.revision).toBe(speciesBefore.revision + 1);
    }, 60_000);
  });
} else {
  describe('one process on PGlite, as before', () => {
    let h: DbHandle;
    let memberId: string;
    beforeAll(async () => {
      h = await openDatabase({ pgliteDir: 'memory' });
      cleanups.push(() => h.close());
      setDbHandle(h);
      await seedUsers(h.db);
      [{ id: memberId }] = await h.db.select({ id: users.id }).from(users).where(eq(users.email, 'member@candlewise.test'));
    });

    it('counts sign-in failures in memory, not in the table', async () => {
      const email = `${fresh('pglite')}@candlewise.test`;
      const now = intoMinute(20_000);
      for (let i = 0; i < MAX_FAILURES_PER_EMAIL - 1; i++) await recordSignInFailure(email, `10.50.0.${i}`, now);
      expect(await isSignInBlocked(email, '10.60.0.1', now)).toBe(false);
      await recordSignInFailure(email, '10.50.0.99', now);
      expect(await isSignInBlocked(email, '10.60.0.1', now)).toBe(true);
      expect(await takeToken(fresh('k'), 1, 60_000, now)).toBe(true);
      expect(await h.db.select().from(rateLimits)).toEqual([]);
    });

    it('starts no listener, and keeps an account until this process writes it', async () => {
      startInvalidationListener(h);
      expect(invalidationListenerState(h)).toBe('off');
      expect((await findSessionAccount(memberId))?.role).toBe('member');
      await h.db.update(users).set({ role: 'editor' }).where(eq(users.id, memberId));
      // Only a write through this process's data layer changes accounts here, and it announces.
      expect((await findSessionAccount(memberId))?.role).toBe('member');
      await announceInvalidation({ kind: 'account', id: memberId });
      expect((await findSessionAccount(memberId))?.role).toBe('editor');
      // No time-to-live on PGlite: the copy is exact until the next write.
      const clock = vi.spyOn(Date, 'now').mockReturnValue(Date.now() + 10 * ACCOUNT_TTL_MS);
      try {
        await h.db.update(users).set({ role: 'member' }).where(eq(users.id, memberId));
        expect((await findSessionAccount(memberId))?.role).toBe('editor');
      } finally {
        clock.mockRestore();
      }
    });
  });
}
