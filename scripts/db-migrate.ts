import { openDatabase } from '../db/open';
import { env } from '../lib/env';

// Applies the migrations in db/migrations to PGLITE_DIR, or to DATABASE_URL when it is set.
// Refuses (through the directory lock) while a server has the same PGlite directory open.
async function main() {
  const handle = await openDatabase({ databaseUrl: env.DATABASE_URL, pgliteDir: env.PGLITE_DIR });
  console.log(`migrations applied (${handle.kind}${handle.kind === 'pglite' ? `: ${env.PGLITE_DIR}` : ''})`);
  await handle.close();
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
