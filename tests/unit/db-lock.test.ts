import { afterEach, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { openDatabase, InterruptedInitError, type DbHandle } from '@/db/open';
import { DataDirLockedError, lockPathFor } from '@/db/lock';
import { users } from '@/db/schema';
import { seed, demoAccounts } from '@/db/seed';

const opened: DbHandle[] = [];
const tmp = () => fs.mkdtempSync(path.join(os.tmpdir(), 'cw-unit-'));
afterEach(async () => {
  while (opened.length) await opened.pop()!.close();
});

describe('database', () => {
  it('migrates an in-memory database and seeds idempotently', async () => {
    const h = await openDatabase({ pgliteDir: 'memory' });
    opened.push(h);
    await seed(h.db);
    await seed(h.db);
    const rows = await h.db.select({ email: users.email }).from(users);
    expect(rows.map((r) => r.email).sort()).toEqual(demoAccounts.map((a) => a.email).sort());
  });

  it('refuses a second opener of the same directory while the first holds it', async () => {
    const dir = path.join(tmp(), 'pglite');
    const first = await openDatabase({ pgliteDir: dir });
    opened.push(first);
    await expect(openDatabase({ pgliteDir: dir })).rejects.toBeInstanceOf(Error);
    // A real second process gets the clear message too.
    const child = spawnSync(
      process.execPath,
      ['-e', `const fs=require('fs');try{const fd=fs.openSync(${JSON.stringify(lockPathFor(dir))},'wx');console.log('took')}catch(e){console.log(e.code)}`],
      { encoding: 'utf8' },
    );
    expect(child.stdout.trim()).toBe('EEXIST');
  });

  it('names the owning process in the refusal', async () => {
    const dir = path.join(tmp(), 'pglite');
    fs.mkdirSync(path.dirname(dir), { recursive: true });
    // A live process that is not us (our parent) holds the lock.
    fs.writeFileSync(lockPathFor(dir), String(process.ppid));
    const err = await openDatabase({ pgliteDir: dir }).catch((e) => e);
    expect(err).toBeInstanceOf(DataDirLockedError);
    expect(String(err.message)).toContain(String(process.ppid));
    expect(fs.existsSync(path.join(dir, 'PG_VERSION'))).toBe(false);
  });

  it('takes over a stale lock left by a dead process and keeps data across reopen', async () => {
    const dir = path.join(tmp(), 'pglite');
    fs.mkdirSync(path.dirname(dir), { recursive: true });
    fs.writeFileSync(lockPathFor(dir), '999999');
    const h = await openDatabase({ pgliteDir: dir });
    await seed(h.db);
    await h.close();
    expect(fs.existsSync(lockPathFor(dir))).toBe(false);
    const again = await openDatabase({ pgliteDir: dir });
    opened.push(again);
    expect((await again.db.select({ id: users.id }).from(users)).length).toBe(demoAccounts.length);
  });

  it('reports a directory whose first initialisation was interrupted', async () => {
    const dir = path.join(tmp(), 'pglite');
    fs.mkdirSync(dir, { recursive: true });
    fs.writeFileSync(`${dir}.initialising`, '123');
    fs.writeFileSync(path.join(dir, 'half-written'), 'x');
    await expect(openDatabase({ pgliteDir: dir })).rejects.toBeInstanceOf(InterruptedInitError);
  });
});
