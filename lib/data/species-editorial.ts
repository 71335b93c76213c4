import 'server-only';
import { and, eq } from 'drizzle-orm';
import { getDb, type Db } from '@/db/client';
import { species, speciesRevisions } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { invalidateReads } from './read-cache';
import { announceInvalidation } from './invalidation';
import type { SessionUser } from '@/lib/auth/session';
import { parseSpeciesMarkdown, speciesColumns } from '@/lib/species/content';
import {
  missingCitations,
  speciesRecordSchema,
  type SpeciesCreateInput,
  type SpeciesImportInput,
  type SpeciesPatchInput,
  type SpeciesRecord,
} from '@/lib/validation/species';
import type { FieldErrors } from '@/lib/errors';
import { assertRole } from '@/lib/auth/roles';

// Editorial writes. Every function checks the editor role itself; callers pass the actor.
// Each save is a new revision; `species.latest_revision` is bumped with a compare-and-set so two
// editors saving on the same base revision cannot both win (the second gets 409).

export interface SavedRevision {
  slug: string;
  revision: number;
  status: 'draft' | 'published';
  publishedRevision: number | null;
  latestRevision: number;
}

function assertEditor(actor: SessionUser) {
  assertRole(actor, 'editor', 'species', 'Only species editors can change species.');
}

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

async function writeRevision(
  tx: Tx,
  row: { id: number; publishedRevision: number | null },
  revision: number,
  input: { record: SpeciesRecord; body: string; summary: string; publish: boolean },
  actor: SessionUser,
): Promise<SavedRevision> {
  const status = input.publish ? 'published' : 'draft';
  if (input.publish) {
    // Only publishing needs every citation; a draft may wait for one.
    const uncited = missingCitations(input.record);
    if (Object.keys(uncited).length) {
      const fields = Object.fromEntries(Object.entries(uncited).map(([k, v]) => [`record.${k}`, v]));
      throw new AppError('invalid:citation', 'Add the missing citations before publishing, or save as a draft.', fields);
    }
  }
  await tx.insert(speciesRevisions).values({
    speciesId: row.id,
    revision,
    status,
    data: input.record,
    body: input.body,
    summary: input.summary,
    editorId: actor.id,
  });
  // The searchable columns follow the published revision; a never-published species shows its
  // newest draft (to editors only).
  const publishedRevision = input.publish ? revision : row.publishedRevision;
  const cols = input.publish || row.publishedRevision == null ? speciesColumns(input.record) : {};
  await tx
    .update(species)
    .set({ ...cols, publishedRevision, updatedAt: new Date() })
    .where(eq(species.id, row.id));
  // Cached wizard reads of species are stale from here on (PGlite queues other reads behind this
  // transaction, so none can re-cache the old revision before it commits). After the commit the
  // caller announces it too (again here, where PostgreSQL's other connections may have read, and
  // to the other server processes).
  invalidateReads('species');
  return { slug: input.record.slug, revision, status, publishedRevision, latestRevision: revision };
}

export async function createSpecies(actor: SessionUser, input: SpeciesCreateInput, exec?: Db | Tx): Promise<SavedRevision> {
  assertEditor(actor);
  const db = exec ?? (await getDb());
  // Inside a caller's transaction this nests as a savepoint (and the caller announces the write).
  const saved = await db.transaction(async (tx) => {
    const [row] = await tx
      .insert(species)
      .values({ ...speciesColumns(input.record), latestRevision: 1, publishedRevision: null })
      .onConflictDoNothing({ target: species.slug })
      .returning({ id: species.id, publishedRevision: species.publishedRevision });
    if (!row) throw new AppError('conflict:slug', 'A species with this slug already exists.', { 'record.slug': ['Already in the knowledge base'] });
    return writeRevision(tx, row, 1, input, actor);
  });
  if (!exec) await announceInvalidation({ kind: 'species' });
  return saved;
}

async function saveOnBase(
  actor: SessionUser,
  slug: string,
  baseRevision: number,
  input: { record: SpeciesRecord; body: string; summary: string; publish: boolean },
  exec?: Db | Tx,
): Promise<SavedRevision> {
  assertEditor(actor);
  if (input.record.slug !== slug) {
    throw new AppError('invalid:slug', 'The slug of a species cannot change.', { 'record.slug': [`Keep it as ${slug}`] });
  }
  const db = exec ?? (await getDb());
  const saved = await db.transaction(async (tx) => {
    const [current] = await tx
      .select({ id: species.id, latestRevision: species.latestRevision, publishedRevision: species.publishedRevision })
      .from(species)
      .where(eq(species.slug, slug))
      .limit(1);
    if (!current) throw new AppError('not_found:species', 'No species with that name.');
    const [bumped] = await tx
      .update(species)
      .set({ latestRevision: baseRevision + 1 })
      .where(and(eq(species.id, current.id), eq(species.latestRevision, baseRevision)))
      .returning({ id: species.id });
    if (!bumped) {
      throw new AppError(
        'conflict:revision',
        `Revision ${current.latestRevision} was saved after the one you started from (${baseRevision}). Reload, then make your change again.`,
        {
          baseRevision: [`The latest revision is ${current.latestRevision}`],
        },
      );
    }
    return writeRevision(tx, current, baseRevision + 1, input, actor);
  });
  if (!exec) await announceInvalidation({ kind: 'species' });
  return saved;
}

export function updateSpecies(actor: SessionUser, slug: string, input: SpeciesPatchInput): Promise<SavedRevision> {
  return saveOnBase(actor, slug, input.baseRevision, input);
}

/** Revert: a new revision carrying an old revision's content (history is never rewritten). */
export async function revertSpecies(
  actor: SessionUser,
  slug: string,
  input: { toRevision: number; baseRevision: number; summary: string; publish: boolean },
): Promise<SavedRevision> {
  assertEditor(actor);
  const db = await getDb();
  const [old] = await db
    .select({ data: speciesRevisions.data, body: speciesRevisions.body })
    .from(speciesRevisions)
    .innerJoin(species, eq(species.id, speciesRevisions.speciesId))
    .where(and(eq(species.slug, slug), eq(speciesRevisions.revision, input.toRevision)))
    .limit(1);
  if (!old) throw new AppError('not_found:revision', 'No such revision of this species.');
  const record = speciesRecordSchema.parse(old.data);
  return saveOnBase(actor, slug, input.baseRevision, {
    record,
    body: old.body,
    summary: input.summary || `Reverted to revision ${input.toRevision}`,
    publish: input.publish,
  });
}

// ---- Import ----

export interface ImportPreviewItem {
  name: string;
  ok: boolean;
  slug?: string;
  botanicalName?: string;
  action?: 'create' | 'update' | 'unchanged';
  message?: string;
  fields?: FieldErrors;
}

async function previewFiles(files: SpeciesImportInput['files']) {
  const db = await getDb();
  const seen = new Set<string>();
  const out: (ImportPreviewItem & { parsed?: { record: SpeciesRecord; body: string } })[] = [];
  for (const f of files) {
    if (!f.name.toLowerCase().endsWith('.md')) {
      out.push({ name: f.name, ok: false, message: 'Only .md files are imported.', fields: { file: ['Not a .md file'] } });
      continue;
    }
    const r = parseSpeciesMarkdown(f.content);
    if (!r.ok) {
      out.push({ name: f.name, ok: false, message: r.message, fields: r.fields });
      continue;
    }
    const slug = r.record.slug;
    if (seen.has(slug)) {
      out.push({ name: f.name, ok: false, slug, message: 'Another file in this import has the same slug.', fields: { slug: ['Duplicate in this import'] } });
      continue;
    }
    seen.add(slug);
    const [existing] = await db
      .select({ data: speciesRevisions.data, body: speciesRevisions.body })
      .from(species)
      .innerJoin(speciesRevisions, and(eq(speciesRevisions.speciesId, species.id), eq(speciesRevisions.revision, species.latestRevision)))
      .where(eq(species.slug, slug))
      .limit(1);
    const [known] = existing ? [true] : await db.select({ id: species.id }).from(species).where(eq(species.slug, slug)).limit(1);
    const unchanged = !!existing && JSON.stringify(speciesRecordSchema.parse(existing.data)) === JSON.stringify(r.record) && existing.body === r.body;
    out.push({
      name: f.name,
      ok: true,
      slug,
      botanicalName: r.record.botanicalName,
      action: unchanged ? 'unchanged' : known ? 'update' : 'create',
      parsed: { record: r.record, body: r.body },
    });
  }
  return out;
}

/** Validate uploaded files and say what an import would do, writing nothing. */
export async function previewSpeciesImport(actor: SessionUser, files: SpeciesImportInput['files']): Promise<ImportPreviewItem[]> {
  assertEditor(actor);
  return (await previewFiles(files)).map(({ parsed: _parsed, ...item }) => item);
}

/**
 * All or nothing by default: if any file is invalid, nothing is written and the preview comes back
 * as the error. With `skipInvalid` the valid files are written and the invalid ones come back in
 * `skipped`, each with its messages per field.
 */
export async function commitSpeciesImport(
  actor: SessionUser,
  input: Omit<SpeciesImportInput, 'skipInvalid'> & { skipInvalid?: boolean },
): Promise<{ results: (SavedRevision | { slug: string; action: 'unchanged' })[]; skipped: ImportPreviewItem[] }> {
  assertEditor(actor);
  const all = await previewFiles(input.files);
  const bad = all.filter((p) => !p.ok);
  const preview = all.filter((p) => p.ok);
  if (bad.length && (!input.skipInvalid || !preview.length)) {
    const fields: FieldErrors = {};
    for (const b of bad) for (const [k, v] of Object.entries(b.fields ?? {})) fields[`${b.name}: ${k}`] = v;
    throw new AppError(
      'invalid:import',
      preview.length ? `${bad.length} file(s) are not valid; nothing was imported.` : 'No file in this import is valid; nothing was imported.',
      fields,
    );
  }
  const skipped = bad.map(({ parsed: _parsed, ...item }) => item);
  const summary = input.summary || 'Imported from a species file';
  const db = await getDb();
  // One transaction: a conflict on any file (say, an edit saved meanwhile) writes none of them.
  const results = await db.transaction(async (tx) => {
    const results: (SavedRevision | { slug: string; action: 'unchanged' })[] = [];
    for (const p of preview) {
      const { record, body } = p.parsed!;
      if (p.action === 'unchanged') {
        results.push({ slug: record.slug, action: 'unchanged' });
      } else if (p.action === 'create') {
        results.push(await createSpecies(actor, { record, body, summary, publish: input.publish }, tx));
      } else {
        const [row] = await tx.select({ latest: species.latestRevision }).from(species).where(eq(species.slug, record.slug)).limit(1);
        results.push(await saveOnBase(actor, record.slug, row.latest, { record, body, summary, publish: input.publish }, tx));
      }
    }
    return results;
  });
  // Again after the commit: a read on another connection during the transaction may have cached
  // the old rows; and the other server processes hear of it.
  await announceInvalidation({ kind: 'species' });
  return { results, skipped };
}
