import 'server-only';
import { and, asc, desc, eq, isNotNull } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { species, speciesRevisions, users } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { cachedRead } from './read-cache';
import type { SessionUser } from '@/lib/auth/session';
import { hasRole } from '@/lib/auth/roles';
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
async function getPublishedRecord(slug: string): Promise<{ record: SpeciesRecord; body: string; revision: number } | null> {
  const db = await getDb();
  const [row] = await db
    .select({ data: speciesRevisions.data, body: speciesRevisions.body, revision: speciesRevisions.revision })
    .from(species)
    .innerJoin(speciesRevisions, and(eq(speciesRevisions.speciesId, species.id), eq(speciesRevisions.revision, species.publishedRevision)))
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
  // Every evaluation reads its species: keep the parsed published record for a few seconds
  // (species-editorial.ts invalidates on every write).
  const db = await getDb();
  return cachedRead(db, 'species', slug, async () => {
    const pub = await getPublishedRecord(slug);
    return pub ? toWizardSpecies(pub.record, pub.revision) : null;
  });
}

/**
 * Every published species as the wizard reads it, for a phone to keep and evaluate with when it
 * has no signal. A stored revision that fails the schema is left out, as getPublishedRecord does.
 */
export async function listPublishedWizardSpecies(): Promise<WizardSpecies[]> {
  const db = await getDb();
  const rows = await db
    .select({ slug: species.slug, data: speciesRevisions.data, revision: speciesRevisions.revision })
    .from(species)
    .innerJoin(speciesRevisions, and(eq(speciesRevisions.speciesId, species.id), eq(speciesRevisions.revision, species.publishedRevision)))
    .where(eq(speciesRevisions.status, 'published'))
    .orderBy(asc(species.slug));
  const out: WizardSpecies[] = [];
  for (const r of rows) {
    const parsed = speciesRecordSchema.safeParse(r.data);
    if (parsed.success) out.push(toWizardSpecies(parsed.data, r.revision));
    else console.error('[candlewise] stored species revision fails the schema', r.slug, r.revision);
  }
  return out;
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

// ---- Viewer-aware reads for the pages and the API ----

export interface SpeciesDetailDto {
  slug: string;
  revision: number;
  status: 'draft' | 'published';
  record: SpeciesRecord;
  body: string;
  publishedRevision: number | null;
  latestRevision: number;
  savedAt: string;
  editorName: string | null;
  summary: string;
}

export interface SpeciesRevisionDto {
  revision: number;
  status: 'draft' | 'published';
  summary: string;
  editorName: string | null;
  savedAt: string;
  current: boolean;
}

const isEditor = (viewer: SessionUser | null) => !!viewer && hasRole(viewer.role, 'editor');

async function findSpeciesRow(slug: string) {
  const db = await getDb();
  const [row] = await db
    .select({ id: species.id, slug: species.slug, publishedRevision: species.publishedRevision, latestRevision: species.latestRevision })
    .from(species)
    .where(eq(species.slug, slug))
    .limit(1);
  return row ?? null;
}

/**
 * One revision of a species as the viewer may see it. Without `revision`: the published one
 * (editors fall back to the newest draft of a never-published species). With `revision`:
 * editors see any; members may name only a published revision (the history page diffs them);
 * drafts are a 404 to everyone else, exactly like an unknown slug.
 */
export async function getSpeciesForViewer(viewer: SessionUser | null, slug: string, revision?: number): Promise<SpeciesDetailDto> {
  const row = await findSpeciesRow(slug);
  const editor = isEditor(viewer);
  if (!row || (!editor && row.publishedRevision == null)) throw new AppError('not_found:species', 'No species with that name.');
  const wanted = revision ?? row.publishedRevision ?? row.latestRevision;
  const db = await getDb();
  const [rev] = await db
    .select({
      revision: speciesRevisions.revision,
      status: speciesRevisions.status,
      data: speciesRevisions.data,
      body: speciesRevisions.body,
      summary: speciesRevisions.summary,
      createdAt: speciesRevisions.createdAt,
      editorName: users.name,
    })
    .from(speciesRevisions)
    .leftJoin(users, eq(users.id, speciesRevisions.editorId))
    .where(and(eq(speciesRevisions.speciesId, row.id), eq(speciesRevisions.revision, wanted), editor ? undefined : eq(speciesRevisions.status, 'published')))
    .limit(1);
  if (!rev) throw new AppError('not_found:revision', 'No such revision of this species.');
  const parsed = speciesRecordSchema.safeParse(rev.data);
  if (!parsed.success) throw new AppError('not_found:revision', 'This revision cannot be read.');
  return {
    slug: row.slug,
    revision: rev.revision,
    status: rev.status,
    record: parsed.data,
    body: rev.body,
    publishedRevision: row.publishedRevision,
    latestRevision: editor ? row.latestRevision : (row.publishedRevision ?? 0),
    savedAt: rev.createdAt.toISOString(),
    editorName: rev.editorName,
    summary: rev.summary,
  };
}

/** Every revision, newest first. Members see published revisions only; a draft-only species is a 404 to them. */
export async function listSpeciesRevisions(viewer: SessionUser | null, slug: string): Promise<SpeciesRevisionDto[]> {
  const row = await findSpeciesRow(slug);
  const editor = isEditor(viewer);
  if (!row || (!editor && row.publishedRevision == null)) throw new AppError('not_found:species', 'No species with that name.');
  const db = await getDb();
  const rows = await db
    .select({
      revision: speciesRevisions.revision,
      status: speciesRevisions.status,
      summary: speciesRevisions.summary,
      createdAt: speciesRevisions.createdAt,
      editorName: users.name,
    })
    .from(speciesRevisions)
    .leftJoin(users, eq(users.id, speciesRevisions.editorId))
    .where(and(eq(speciesRevisions.speciesId, row.id), editor ? undefined : eq(speciesRevisions.status, 'published')))
    .orderBy(desc(speciesRevisions.revision));
  return rows.map((r) => ({
    revision: r.revision,
    status: r.status,
    summary: r.summary,
    editorName: r.editorName,
    savedAt: r.createdAt.toISOString(),
    current: r.revision === row.publishedRevision,
  }));
}

/** Every published species as records, for the export. */
export async function listPublishedRecords(): Promise<{ record: SpeciesRecord; body: string; revision: number }[]> {
  const db = await getDb();
  const rows = await db
    .select({ data: speciesRevisions.data, body: speciesRevisions.body, revision: speciesRevisions.revision })
    .from(species)
    .innerJoin(speciesRevisions, and(eq(speciesRevisions.speciesId, species.id), eq(speciesRevisions.revision, species.publishedRevision)))
    .orderBy(asc(species.slug));
  return rows.flatMap((r) => {
    const parsed = speciesRecordSchema.safeParse(r.data);
    return parsed.success ? [{ record: parsed.data, body: r.body, revision: r.revision }] : [];
  });
}
