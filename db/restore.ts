import 'server-only';
import fs from 'node:fs';
import path from 'node:path';
import { acquireDirLock } from './lock';
import { snapshotterForPglite, snapshotterForPostgres, tableChecksums, type Checksums } from './backup';

// Restores write into a fresh target only: an existing club database is never overwritten.

function assertEmptyDir(abs: string) {
  if (fs.existsSync(abs) && fs.readdirSync(abs).length > 0) {
    throw new Error(`${abs} already holds a database. Restore into a new directory (set PGLITE_DIR) or move this one aside first.`);
  }
}

/** Load into a new PGlite directory, under the same lock and initialising marker as db/open.ts. */
async function intoNewPgliteDir(dir: string, load: (pg: import('@electric-sql/pglite').PGlite) => Promise<void>, loadDataDir?: Blob): Promise<Checksums> {
  const { PGlite } = await import('@electric-sql/pglite');
  const abs = path.resolve(dir);
  const release = acquireDirLock(abs);
  const marker = `${abs}.initialising`;
  try {
    if (fs.existsSync(marker)) throw new Error(`${abs} was left half-initialised; remove it and ${marker} first.`);
    assertEmptyDir(abs);
    fs.mkdirSync(path.dirname(abs), { recursive: true });
    fs.writeFileSync(marker, String(process.pid));
    const pg = new PGlite(abs, loadDataDir ? { loadDataDir } : {});
    try {
      await pg.waitReady;
      await load(pg);
      const sums = await tableChecksums(snapshotterForPglite(pg));
      await pg.close();
      fs.rmSync(marker, { force: true });
      return sums;
    } catch (e) {
      await pg.close().catch(() => {});
      throw e;
    }
  } finally {
    release();
  }
}

export function restoreTarballToDir(file: string, dir: string) {
  const blob = new Blob([fs.readFileSync(file)], { type: 'application/x-gzip' });
  return intoNewPgliteDir(dir, async () => {}, blob);
}

export function restoreSqlToDir(file: string, dir: string) {
  const text = fs.readFileSync(file, 'utf8');
  return intoNewPgliteDir(dir, async (pg) => {
    await pg.exec(text);
  });
}

/** Load a SQL dump into an empty PostgreSQL database. */
export async function restoreSqlToPostgres(file: string, url: string): Promise<Checksums> {
  const { default: postgres } = await import('postgres');
  const client = postgres(url, { max: 1, onnotice: () => {} });
  try {
    const [{ n }] = await client<{ n: number }[]>`
      select count(*)::int as n from pg_class c join pg_namespace ns on ns.oid = c.relnamespace
      where c.relkind = 'r' and ns.nspname in ('public', 'drizzle')`;
    if (n > 0) throw new Error('The target database is not empty. Create a new database and restore into it.');
    await client.unsafe(fs.readFileSync(file, 'utf8')).simple();
    return await tableChecksums(snapshotterForPostgres(client));
  } finally {
    await client.end({ timeout: 5 });
  }
}
