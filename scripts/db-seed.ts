import { openDatabase } from '../db/open';
import { seed } from '../db/seed';
import { env } from '../lib/env';

async function main() {
  const handle = await openDatabase({ databaseUrl: env.DATABASE_URL, pgliteDir: env.PGLITE_DIR });
  await seed(handle.db);
  console.log('seed applied');
  await handle.close();
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
