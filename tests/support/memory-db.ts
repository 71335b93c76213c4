import { afterAll, beforeAll } from 'vitest';
import { eq } from 'drizzle-orm';
import { openDatabase, type DbHandle } from '@/db/open';
import { setDbHandle } from '@/db/client';
import { seed, seeders } from '@/db/seed';
import { seedRecord } from '@/db/seed-record';
import { users } from '@/db/schema';
import type { SessionUser } from '@/lib/auth/session';

// One in-memory PGlite per test file, the way the app opens its own: migrated by the shipped
// migrations, seeded with the demo club, and installed as the app's database (lib/data reads it
// through getDb), then closed after the file.

export interface MemoryDb {
  readonly handle: DbHandle;
  readonly db: DbHandle['db'];
  /** The demo account with this e-mail, as the session would carry it. */
  user(email: string): Promise<SessionUser>;
}

/**
 * Call at the top of a test file. `record: false` seeds users, settings and species only (for
 * files that make their own trees, answers and notes).
 */
export function memoryDb(opts: { record?: boolean } = {}): MemoryDb {
  let handle: DbHandle | undefined;
  const open = () => {
    if (!handle) throw new Error('the in-memory database opens in beforeAll; use it inside a hook or a test');
    return handle;
  };
  beforeAll(async () => {
    handle = await openDatabase({ pgliteDir: 'memory' });
    setDbHandle(handle);
    if (opts.record === false) {
      for (const s of seeders.filter((x) => x !== seedRecord)) await s(handle.db);
    } else {
      await seed(handle.db);
    }
  }, 60_000);
  afterAll(async () => {
    await handle?.close();
    handle = undefined;
  });
  return {
    get handle() {
      return open();
    },
    get db() {
      return open().db;
    },
    async user(email) {
      const [u] = await open()
        .db.select({ id: users.id, name: users.name, email: users.email, role: users.role, tokenVersion: users.tokenVersion })
        .from(users)
        .where(eq(users.email, email));
      if (!u) throw new Error(`no demo account ${email}`);
      return { ...u, name: u.name ?? '' };
    },
  };
}
