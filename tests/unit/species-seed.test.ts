import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { count, eq } from 'drizzle-orm';
import { openDatabase, type DbHandle } from '@/db/open';
import { setDbHandle } from '@/db/client';
import { seed } from '@/db/seed';
import { species, speciesRevisions } from '@/db/schema';
import { getWizardSpecies, listWizardSpeciesNames } from '@/lib/data/species';

let handle: DbHandle;

beforeAll(async () => {
  handle = await openDatabase({ pgliteDir: 'memory' });
  setDbHandle(handle);
  await seed(handle.db);
});
afterAll(() => handle?.close());

describe('species seeder and wizard reads', () => {
  it('is idempotent and leaves an existing slug alone', async () => {
    const [before] = await handle.db.select({ n: count() }).from(speciesRevisions);
    await handle.db.update(species).set({ botanicalName: 'Pinus sylvestris (edited)' }).where(eq(species.slug, 'pinus-sylvestris'));
    await seed(handle.db);
    const [after] = await handle.db.select({ n: count() }).from(speciesRevisions);
    expect(after.n).toBe(before.n);
    const [row] = await handle.db.select({ b: species.botanicalName }).from(species).where(eq(species.slug, 'pinus-sylvestris'));
    expect(row.b).toBe('Pinus sylvestris (edited)');
    await handle.db.update(species).set({ botanicalName: 'Pinus sylvestris' }).where(eq(species.slug, 'pinus-sylvestris'));
  });

  it('gives the wizard the published traits', async () => {
    const jbp = await getWizardSpecies('pinus-thunbergii');
    expect(jbp).toMatchObject({ revision: 1, flushHabit: 'double', shootHabit: 'uninodal', commonName: 'Japanese black pine' });
    expect(await getWizardSpecies('pinus-nonexistens')).toBeNull();
  });

  it('lists names for fuzzy search', async () => {
    const names = await listWizardSpeciesNames();
    const mugo = names.find((n) => n.slug === 'pinus-mugo');
    expect(mugo?.synonyms).toContain('mugho');
  });
});
