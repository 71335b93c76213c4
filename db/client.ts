import 'server-only';
import { env } from '@/lib/env';
import { openDatabase, type Db, type DbHandle } from './open';

export type { Db } from './open';

// One database per process. The promise lives on globalThis so hot reload in development
// reuses it, and it is created lazily so `next build` never opens the data directory.
const g = globalThis as unknown as { __candlewiseDb?: Promise<DbHandle>; __candlewiseSignals?: boolean };

function installSignalHandlers() {
  if (g.__candlewiseSignals) return;
  g.__candlewiseSignals = true;
  const shutdown = (signal: NodeJS.Signals) => {
    const pending = g.__candlewiseDb;
    const done = () => process.exit(signal === 'SIGINT' ? 130 : 0);
    if (!pending) return done();
    pending
      .then((h) => h.close())
      .catch(() => {})
      .finally(done);
  };
  process.once('SIGTERM', shutdown);
  process.once('SIGINT', shutdown);
}

export function getDbHandle(): Promise<DbHandle> {
  if (!g.__candlewiseDb) {
    if (process.env.NEXT_PHASE === 'phase-production-build') {
      throw new Error('The database is not opened during `next build`; this code path must be dynamic.');
    }
    installSignalHandlers();
    g.__candlewiseDb = openDatabase({ databaseUrl: env.DATABASE_URL, pgliteDir: env.PGLITE_DIR });
    // A failed open must not be cached forever: the next request tries again and reports again.
    g.__candlewiseDb.catch(() => {
      g.__candlewiseDb = undefined;
    });
  }
  return g.__candlewiseDb;
}

export async function getDb(): Promise<Db> {
  return (await getDbHandle()).db;
}

/** For tests and scripts: use an already opened database as the process database. */
export function setDbHandle(handle: DbHandle) {
  g.__candlewiseDb = Promise.resolve(handle);
}
