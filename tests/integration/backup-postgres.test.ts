import { afterAll, describe, expect, it } from 'vitest';
import { execFileSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { PGlite } from '@electric-sql/pglite';
import { openDatabase } from '@/db/open';
import { compareChecksums, dumpSql, snapshotterForDrizzle, snapshotterForPglite, snapshotterForPostgres, tableChecksums } from '@/db/backup';
import { seed } from '@/db/seed';
import { fillAwkwardRows } from '../support/backup-fixture';

// The SQL dump is meant for real PostgreSQL servers. In the PostgreSQL pass of the integration
// suite (scripts/with-postgres.sh sets TEST_DATABASE_URL) it is loaded with psql into a new
// database on that server, and dumped back from there into PGlite; in the PGlite pass the same
// dump is loaded into a fresh PGlite.
const serverUrl = process.env.TEST_DATABASE_URL;
const target = serverUrl ? 'a real PostgreSQL server (psql)' : 'a fresh PGlite';
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-pgdump-'));
const cleanups: (() => Promise<void>)[] = [];
afterAll(async () => {
  for (const c of cleanups.reverse()) await c();
  fs.rmSync(work, { recursive: true, force: true });
});

async function sourceDump() {
  const h = await openDatabase({ pgliteDir: 'memory' });
  cleanups.push(() => h.close());
  await seed(h.db);
  await fillAwkwardRows(h.db);
  const snap = snapshotterForDrizzle(h.db);
  return { checksums: await tableChecksums(snap), dump: await dumpSql(snap, { source: 'test' }) };
}

async function newServerDatabase(url: string) {
  const { default: postgres } = await import('postgres');
  const admin = postgres(url, { max: 1, onnotice: () => {} });
  const name = `cw_restore_${process.pid}_${Date.now()}`;
  await admin.unsafe(`create database ${name}`);
  const u = new URL(url);
  u.pathname = `/${name}`;
  cleanups.push(async () => {
    await admin.unsafe(`drop database if exists ${name} with (force)`);
    await admin.end({ timeout: 5 });
  });
  return u.toString();
}

function psqlBinary() {
  for (const dir of ['/usr/bin', ...fs.readdirSync('/usr/lib/postgresql').map((v) => `/usr/lib/postgresql/${v}/bin`)]) {
    if (fs.existsSync(`${dir}/psql`)) return `${dir}/psql`;
  }
  throw new Error('psql not found (Debian package postgresql-client)');
}

describe('the SQL dump', () => {
  it(`loads into ${target} with the same row counts and per-table checksums`, async () => {
    const { checksums, dump } = await sourceDump();
    const file = path.join(work, 'dump.sql');
    fs.writeFileSync(file, dump);

    if (!serverUrl) {
      const pg = new PGlite();
      cleanups.push(() => pg.close());
      await pg.exec(dump);
      expect(compareChecksums(checksums, await tableChecksums(snapshotterForPglite(pg)))).toEqual([]);
      return;
    }

    const url = await newServerDatabase(serverUrl);
    execFileSync(psqlBinary(), ['-v', 'ON_ERROR_STOP=1', '-q', '-d', url, '-f', file], { stdio: 'pipe' });
    const { default: postgres } = await import('postgres');
    const client = postgres(url, { max: 1, onnotice: () => {} });
    cleanups.push(() => client.end({ timeout: 5 }));
    expect(compareChecksums(checksums, await tableChecksums(snapshotterForPostgres(client)))).toEqual([]);

    // The app opens the restored database as its own: the migrator finds nothing left to do.
    const app = await openDatabase({ databaseUrl: url });
    cleanups.push(() => app.close());
    expect(compareChecksums(checksums, await tableChecksums(snapshotterForDrizzle(app.db)))).toEqual([]);

    // And back: a dump taken from the server loads into PGlite unchanged.
    const back = await dumpSql(snapshotterForDrizzle(app.db), { source: 'server' });
    const pg = new PGlite();
    cleanups.push(() => pg.close());
    await pg.exec(back);
    expect(compareChecksums(checksums, await tableChecksums(snapshotterForPglite(pg)))).toEqual([]);
  }, 120_000);
});
