// A second server process for tests/integration/shared-state.test.ts: it opens the PostgreSQL
// database named by DATABASE_URL, starts its own invalidation listener as the server does
// (lib/server-start.ts), makes one write through the data layer, prints `done` and exits.
//
//   node --import tsx --require ./tests/crash/server-only-off.js tests/support/other-process.ts role <email> <role>
//   … sign-out <email> | settings <club name> | publish <species slug> <common name>
import fs from 'node:fs';
import path from 'node:path';
import { desc, eq } from 'drizzle-orm';
import { openDatabase } from '../../db/open';
import { setDbHandle } from '../../db/client';
import { species, speciesRevisions, users } from '../../db/schema';
import type { SessionUser } from '../../lib/auth/session';

const say = (line: string) => fs.writeSync(1, `${line}\n`);

async function main() {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error('DATABASE_URL is not set');
  const handle = await openDatabase({ databaseUrl: url, migrationsFolder: path.resolve(__dirname, '../../db/migrations') });
  setDbHandle(handle);
  const { startInvalidationListener, waitForInvalidationListener } = await import('../../lib/data/invalidation');
  startInvalidationListener(handle);
  await waitForInvalidationListener(handle);

  const actor = async (email: string): Promise<SessionUser> => {
    const [u] = await handle.db.select().from(users).where(eq(users.email, email));
    return { id: u.id, name: u.name ?? '', email: u.email, role: u.role, tokenVersion: u.tokenVersion };
  };
  const [command, a1, a2] = process.argv.slice(2);
  if (command === 'role') {
    const { updateUserByAdmin } = await import('../../lib/data/users');
    await updateUserByAdmin(await actor('admin@candlewise.test'), (await actor(a1)).id, { role: a2 as SessionUser['role'] });
  } else if (command === 'sign-out') {
    const { bumpTokenVersion } = await import('../../lib/data/users');
    await bumpTokenVersion((await actor(a1)).id);
  } else if (command === 'settings') {
    const { getClubSettings, updateClubSettings } = await import('../../lib/data/settings');
    await updateClubSettings(await actor('admin@candlewise.test'), { ...(await getClubSettings()), clubName: a1 });
  } else if (command === 'publish') {
    const { updateSpecies } = await import('../../lib/data/species-editorial');
    const [latest] = await handle.db
      .select({ revision: speciesRevisions.revision, data: speciesRevisions.data, body: speciesRevisions.body })
      .from(species)
      .innerJoin(speciesRevisions, eq(speciesRevisions.speciesId, species.id))
      .where(eq(species.slug, a1))
      .orderBy(desc(speciesRevisions.revision))
      .limit(1);
    const record = latest.data as { commonNames: string[] };
    await updateSpecies(await actor('editor@candlewise.test'), a1, {
      record: { ...record, commonNames: [a2, ...record.commonNames.slice(1)] } as never,
      body: latest.body,
      summary: 'Renamed by the other process',
      publish: true,
      baseRevision: latest.revision,
    });
  } else {
    throw new Error(`unknown command ${command}`);
  }
  say('done');
  await handle.close();
}

main().then(
  () => process.exit(0),
  (e: unknown) => {
    console.error(e);
    process.exit(1);
  },
);
