import 'server-only';
import { and, asc, eq, isNotNull, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { answers, species, trees } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { newPublicId } from '@/lib/ids';
import { parseWith } from '@/lib/http/route';
import type { SessionUser } from '@/lib/auth/session';
import { photoFilesOfTree, removeStoredFiles } from '@/lib/data/photos';
import { listWizardSpeciesNames } from '@/lib/data/species';
import { treeInputSchema, type TreeInput, type TreePatch } from '@/lib/validation/trees';

// Trees are private to the member who keeps them: every query is scoped by owner, so another
// member's tree id answers exactly like an id that does not exist (404).

export interface TreeDto extends TreeInput {
  id: string;
  speciesName: string | null;
  createdAt: string;
  updatedAt: string;
}

export interface TreeAnswerDto {
  id: string;
  action: string;
  stage: string;
  season: string;
  observedOn: string;
  visibility: 'private' | 'club';
  note: string;
  followUp: string;
  createdAt: string;
}

export interface SpeciesOptionDto {
  slug: string;
  label: string;
}

const MAX_TREES_PER_MEMBER = 500;

const columns = {
  id: trees.id,
  name: trees.name,
  speciesSlug: trees.speciesSlug,
  speciesName: species.botanicalName,
  speciesCommon: species.commonNames,
  stageNotes: trees.stageNotes,
  containerShape: trees.containerShape,
  containerLengthCm: trees.containerLengthCm,
  containerWidthCm: trees.containerWidthCm,
  acquiredOn: trees.acquiredOn,
  collectedFromWild: trees.collectedFromWild,
  collectedOn: trees.collectedOn,
  notes: trees.notes,
  createdAt: trees.createdAt,
  updatedAt: trees.updatedAt,
};

type Row = { speciesName: string | null; speciesCommon: string[] | null; createdAt: Date; updatedAt: Date } & Omit<
  TreeDto,
  'speciesName' | 'createdAt' | 'updatedAt'
>;

function toDto({ speciesCommon, ...r }: Row): TreeDto {
  const common = speciesCommon?.[0];
  return {
    ...r,
    speciesName: r.speciesName ? (common ? `${common} (${r.speciesName})` : r.speciesName) : null,
    createdAt: r.createdAt.toISOString(),
    updatedAt: r.updatedAt.toISOString(),
  };
}

function baseQuery(db: Awaited<ReturnType<typeof getDb>>) {
  return db.select(columns).from(trees).leftJoin(species, eq(species.slug, trees.speciesSlug));
}

export async function listTrees(actor: SessionUser): Promise<TreeDto[]> {
  const db = await getDb();
  const rows = await baseQuery(db).where(eq(trees.ownerId, actor.id)).orderBy(asc(trees.name), asc(trees.id)).limit(MAX_TREES_PER_MEMBER);
  return rows.map(toDto);
}

/** The actor's own tree, or 404 (also for somebody else's tree). */
export async function getTree(actor: SessionUser, id: string): Promise<TreeDto> {
  const db = await getDb();
  const [row] = await baseQuery(db)
    .where(and(eq(trees.id, id), eq(trees.ownerId, actor.id)))
    .limit(1);
  if (!row) throw new AppError('not_found:tree', 'No such tree.');
  return toDto(row);
}

async function assertSpeciesExists(slug: string) {
  const db = await getDb();
  const [row] = await db
    .select({ slug: species.slug })
    .from(species)
    .where(and(eq(species.slug, slug), isNotNull(species.publishedRevision)))
    .limit(1);
  if (!row) throw new AppError('invalid:species', 'Choose a species from the list.', { speciesSlug: ['Unknown species: choose one from the list.'] });
}

/** Shape the stored values so that a round pot never keeps a stale width. */
function normalise(input: TreeInput): TreeInput {
  return {
    ...input,
    containerLengthCm: input.containerShape ? input.containerLengthCm : null,
    containerWidthCm: input.containerShape && input.containerShape !== 'round' ? input.containerWidthCm : null,
    collectedOn: input.collectedFromWild ? input.collectedOn : null,
  };
}

export async function createTree(actor: SessionUser, input: TreeInput): Promise<TreeDto> {
  const values = normalise(input);
  await assertSpeciesExists(values.speciesSlug);
  const db = await getDb();
  const [{ count }] = await db
    .select({ count: sql<number>`count(*)::int` })
    .from(trees)
    .where(eq(trees.ownerId, actor.id));
  if (count >= MAX_TREES_PER_MEMBER) throw new AppError('conflict:tree_limit', `A member can keep up to ${MAX_TREES_PER_MEMBER} trees.`);
  const id = newPublicId();
  await db.insert(trees).values({ id, ownerId: actor.id, ...values });
  return getTree(actor, id);
}

export async function updateTree(actor: SessionUser, id: string, patch: TreePatch): Promise<TreeDto> {
  const current = await getTree(actor, id);
  const merged = parseWith(treeInputSchema, {
    name: current.name,
    speciesSlug: current.speciesSlug,
    stageNotes: current.stageNotes,
    containerShape: current.containerShape,
    containerLengthCm: current.containerLengthCm,
    containerWidthCm: current.containerWidthCm,
    acquiredOn: current.acquiredOn,
    collectedFromWild: current.collectedFromWild,
    collectedOn: current.collectedOn,
    notes: current.notes,
    ...patch,
  });
  const values = normalise(merged);
  if (values.speciesSlug !== current.speciesSlug) await assertSpeciesExists(values.speciesSlug);
  const db = await getDb();
  const rows = await db
    .update(trees)
    .set({ ...values, updatedAt: new Date() })
    .where(and(eq(trees.id, id), eq(trees.ownerId, actor.id)))
    .returning({ id: trees.id });
  if (!rows[0]) throw new AppError('not_found:tree', 'No such tree.');
  return getTree(actor, id);
}

/** Deletes the tree and its photos (rows by cascade, then their files); answers stay and lose the link. */
export async function deleteTree(actor: SessionUser, id: string): Promise<void> {
  const files = await photoFilesOfTree(actor, id);
  const db = await getDb();
  const rows = await db
    .delete(trees)
    .where(and(eq(trees.id, id), eq(trees.ownerId, actor.id)))
    .returning({ id: trees.id });
  if (!rows[0]) throw new AppError('not_found:tree', 'No such tree.');
  await removeStoredFiles(files);
}

/** The actor's answers about one of their trees, oldest observation first (the tree's story). */
export async function listTreeAnswers(actor: SessionUser, treeId: string): Promise<TreeAnswerDto[]> {
  await getTree(actor, treeId);
  const db = await getDb();
  const rows = await db
    .select({
      id: answers.id,
      action: answers.action,
      stage: answers.stage,
      season: answers.season,
      observedOn: answers.observedOn,
      visibility: answers.visibility,
      note: answers.note,
      followUp: answers.followUp,
      createdAt: answers.createdAt,
    })
    .from(answers)
    .where(and(eq(answers.treeId, treeId), eq(answers.userId, actor.id)))
    .orderBy(asc(answers.observedOn), asc(answers.createdAt))
    .limit(500);
  return rows.map((r) => ({ ...r, createdAt: r.createdAt.toISOString() }));
}

/** Published species for the tree form's select, by botanical name (from the species module). */
export async function listSpeciesOptions(): Promise<SpeciesOptionDto[]> {
  const rows = await listWizardSpeciesNames();
  return rows.map((r) => ({ slug: r.slug, label: r.commonNames[0] ? `${r.botanicalName} — ${r.commonNames[0]}` : r.botanicalName }));
}
