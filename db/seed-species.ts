import 'server-only';
import type { Db } from './open';
import { species, speciesRevisions } from './schema';
import { speciesColumns } from '@/lib/species/content';
import { readSpeciesDir } from '@/lib/species/content-dir';

/**
 * Import content/species/*.md as published revision 1 of each species. Idempotent: a slug
 * already in the database is left alone (editors may have changed it since), and a broken
 * file stops the seed with its file name and fields rather than importing half a record.
 */
export async function seedSpecies(db: Db, dir?: string) {
  const files = readSpeciesDir(dir);
  const broken = files.filter((f) => !f.result.ok);
  if (broken.length) {
    const lines = broken.map((f) => `${f.file}: ${f.result.ok ? '' : JSON.stringify(f.result.fields)}`);
    throw new Error(`Species files failed validation:\n${lines.join('\n')}`);
  }
  for (const { result } of files) {
    if (!result.ok) continue;
    const { record, body } = result;
    await db.transaction(async (tx) => {
      const [row] = await tx
        .insert(species)
        .values({ ...speciesColumns(record), publishedRevision: 1, latestRevision: 1 })
        .onConflictDoNothing({ target: species.slug })
        .returning({ id: species.id });
      if (!row) return;
      await tx.insert(speciesRevisions).values({
        speciesId: row.id,
        revision: 1,
        status: 'published',
        data: record,
        body,
        summary: 'Imported from the species library',
        editorId: null,
      });
    });
  }
}
