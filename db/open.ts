import 'server-only';
import fs from 'node:fs';
import path from 'node:path';
import type { PgDatabase, PgQueryResultHKT } from 'drizzle-orm/pg-core';
import * as schema from './schema';
import { acquireDirLock } from './lock';

export type Db = PgDatabase<PgQueryResultHKT, typeof schema>;

export interface DbHandle {
  db: Db;
  kind: 'pglite' | 'postgres';
  /** The PGlite instance itself (backups dump its data directory); absent on PostgreSQL. */
  pglite?: import('@electric-sql/pglite').PGlite;
  /** The postgres.js client itself (LISTEN for lib/data/invalidation.ts); absent on PGlite. */
  postgres?: import('postgres').Sql;
  close(): Promise<void>;
}

export interface OpenOptions {
  /** A directory for PGlite, or 'memory' for an in-memory database (tests). */
  pgliteDir?: string;
  /** A PostgreSQL connection string; wins over pgliteDir. */
  databaseUrl?: string;
  migrationsFolder?: string;
}

export class InterruptedInitError extends Error {
  constructor(dir: string) {
    super(
      `The data directory ${dir} was left half-initialised (a process stopped during its first start). ` +
        'It holds no committed data: remove the directory (and the .initialising marker beside it) ' +
        'and start again, or restore it from a backup.',
    );
    this.name = 'InterruptedInitError';
  }
}

const defaultMigrations = () => path.resolve(process.cwd(), 'db/migrations');

export async function openDatabase(opts: OpenOptions): Promise<DbHandle> {
  const migrationsFolder = opts.migrationsFolder ?? defaultMigrations();
  if (opts.databaseUrl) return openPostgres(opts.databaseUrl, migrationsFolder);
  return openPglite(opts.pgliteDir ?? 'memory', migrationsFolder);
}

async function openPostgres(url: string, migrationsFolder: string): Promise<DbHandle> {
  const { default: postgres } = await import('postgres');
  const { drizzle } = await import('drizzle-orm/postgres-js');
  const { migrate } = await import('drizzle-orm/postgres-js/migrator');
  const sql = postgres(url, { max: 10, onnotice: () => {} });
  const db = drizzle(sql, { schema });
  await migrate(db, { migrationsFolder });
  return { db: db as unknown as Db, kind: 'postgres', postgres: sql, close: () => sql.end({ timeout: 5 }) };
}

async function openPglite(dir: string, migrationsFolder: string): Promise<DbHandle> {
  const { PGlite } = await import('@electric-sql/pglite');
  const { drizzle } = await import('drizzle-orm/pglite');
  const { migrate } = await import('drizzle-orm/pglite/migrator');

  if (dir === 'memory') {
    const client = new PGlite();
    const db = drizzle(client, { schema });
    await migrate(db, { migrationsFolder });
    return { db: db as unknown as Db, kind: 'pglite', pglite: client, close: () => client.close() };
  }

  const abs = path.resolve(dir);
  const release = acquireDirLock(abs);
  const marker = `${abs}.initialising`;
  try {
    if (fs.existsSync(marker)) throw new InterruptedInitError(abs);
    const fresh = !fs.existsSync(path.join(abs, 'PG_VERSION'));
    if (fresh) {
      if (fs.existsSync(abs) && fs.readdirSync(abs).length > 0) throw new InterruptedInitError(abs);
      fs.mkdirSync(path.dirname(abs), { recursive: true });
      fs.writeFileSync(marker, String(process.pid));
    }
    const client = new PGlite(abs);
    await client.waitReady;
    const db = drizzle(client, { schema });
    await migrate(db, { migrationsFolder });
    if (fresh) fs.rmSync(marker, { force: true });
    let closed = false;
    return {
      db: db as unknown as Db,
      kind: 'pglite',
      pglite: client,
      close: async () => {
        if (closed) return;
        closed = true;
        try {
          await client.close();
        } finally {
          release();
        }
      },
    };
  } catch (e) {
    release();
    throw e;
  }
}
