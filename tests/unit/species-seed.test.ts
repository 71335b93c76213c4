import { describe, expect, it } from 'vitest';
import { memoryDb } from '../support/memory-db';
import { count, eq } from 'drizzle-orm';
import { seed } from '@/db/seed';
import { species, speciesRevisions } from '@/db/schema';
import { getWizardSpecies, listWizardSpeciesNames } from '@/lib/data/species';

const mem = memoryDb();

describe('species seeder and wizard reads', () => {
  it('is idempotent and leaves an existing slug alone', async () => {
    const [before] = await mem.db.select({ n: count() }).from(speciesRevisions);
    await mem.db.update(species).set({ botanicalName: 'Pinus sylvestris (edited)' }).where(eq(species.slug, 'pinus-sylvestris'));
    await seed(mem.db);
    const [after] = await mem.db.select({ n: count() }).from(speciesRevisions);
    expect(after.n).toBe(before.n);
    const [row] = await mem.db.select({ b: species.botanicalName }).from(species).where(eq(species.slug, 'pinus-sylvestris'));
    expect(row.b).toBe('Pinus sylvestris (edited)');
    await mem.db.update(species).set({ botanicalName: 'Pinus sylvestris' }).where(eq(species.slug, 'pinus-sylvestris'));
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
