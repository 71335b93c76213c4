import 'server-only';
import { and, asc, eq, isNotNull } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { species, speciesRevisions } from '@/db/schema';
import { speciesRecordSchema, toWizardSpecies, type SpeciesRecord, type WizardSpecies } from '@/lib/validation/species';

// Read access to published species for everyone (signed in or not). Drafts never leave
// through this module; the editorial functions live in species-editorial.ts.

export interface SpeciesNameDto {
  slug: string;
  botanicalName: string;
  commonNames: string[];
  synonyms: string[];
}

/** The published record of a species and its revision number, or null (unknown or never published). */
export async function getPublishedRecord(slug: string): Promise<{ record: SpeciesRecord; body: string; revision: number } | null> {
  const db = await getDb();
  const [row] = await db
    .select({ data: speciesRevisions.data, body: speciesRevisions.body, revision: speciesRevisions.revision })
    .from(species)
    .innerJoin(
      speciesRevisions,
      and(eq(speciesRevisions.speciesId, species.id), eq(speciesRevisions.revision, species.publishedRevision)),
    )
    .where(and(eq(species.slug, slug), eq(speciesRevisions.status, 'published')))
    .limit(1);
  if (!row) return null;
  // Stored revisions were validated on the way in; parse again so a hand-edited row cannot
  // hand the wizard a malformed species.
  const parsed = speciesRecordSchema.safeParse(row.data);
  if (!parsed.success) {
    console.error('[candlewise] stored species revision fails the schema', slug, row.revision);
    return null;
  }
  return { record: parsed.data, body: row.body, revision: row.revision };
}

/** What the wizard needs of a species, from its published revision only. */
export async function getWizardSpecies(slug: string): Promise<WizardSpecies | null> {
  const pub = await getPublishedRecord(slug);
  return pub ? toWizardSpecies(pub.record, pub.revision) : null;
}

/** Names of every published species, for fuzzy search in the wizard's species picker. */
export async function listWizardSpeciesNames(): Promise<SpeciesNameDto[]> {
  const db = await getDb();
  return db
    .select({ slug: species.slug, botanicalName: species.botanicalName, commonNames: species.commonNames, synonyms: species.synonyms })
    .from(species)
    .where(isNotNull(species.publishedRevision))
    .orderBy(asc(species.botanicalName));
}
