import 'server-only';
import type { FlushHabit } from '@/lib/validation/species';
import { and, asc, eq, gt, gte, isNotNull, lte, or, type SQL } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { species } from '@/db/schema';
import { AppError } from '@/lib/errors';
import type { SessionUser } from '@/lib/auth/session';
import { hasRole } from '@/lib/auth/roles';
import { cachedRead } from './read-cache';
import { buildSpeciesIndex, compareHits, matchNote, queryWords, searchSpecies, cmp, type SearchMatch, type SpeciesSearchIndex } from '@/lib/species/search';
import type { SpeciesListQuery } from '@/lib/validation/species';

export interface SpeciesListItem {
  slug: string;
  botanicalName: string;
  commonNames: string[];
  synonyms: string[];
  genus: string;
  group: string;
  flushHabit: FlushHabit | null;
  needleLengthMm: { min: number | null; max: number | null };
  vigour: 'low' | 'moderate' | 'high' | null;
  publishedRevision: number | null;
  /** Editors only: the newest revision and whether it is an unpublished draft. */
  latestRevision?: number;
  hasDraft?: boolean;
  /** With a query: the rank (lower is better) and which name matched, said in words when worth saying. */
  score?: number;
  match?: SearchMatch & { note: string | null };
}

export interface SpeciesListPage {
  items: SpeciesListItem[];
  nextCursor: string | null;
}

type Cursor = { b: string; s: string; sc?: number; h?: string };

function encodeCursor(c: Cursor) {
  return Buffer.from(JSON.stringify(c)).toString('base64url');
}

const badCursor = () =>
  new AppError('bad_request:cursor', 'The cursor is not valid: start again from the first page.', { cursor: ['Not a cursor this list gave out'] });

function decodeCursor(raw: string | undefined, searchKey: string | null): Cursor | null {
  if (!raw) return null;
  let c: Cursor;
  try {
    c = JSON.parse(Buffer.from(raw, 'base64url').toString('utf8')) as Cursor;
  } catch {
    throw badCursor();
  }
  if (!c || typeof c.b !== 'string' || typeof c.s !== 'string') throw badCursor();
  // A search cursor belongs to one query and one set of filters: another search would skip or repeat rows.
  if (searchKey === null ? c.sc !== undefined || c.h !== undefined : !Number.isSafeInteger(c.sc) || c.h !== searchKey) throw badCursor();
  return c;
}

/** A short, stable fingerprint of what a search page depends on (FNV-1a over the words and filters). */
function searchFingerprint(query: SpeciesListQuery) {
  const text = JSON.stringify([
    queryWords(query.q ?? ''),
    query.group ?? '',
    query.flush ?? '',
    query.vigour ?? '',
    query.needleMin ?? '',
    query.needleMax ?? '',
  ]);
  let h = 0x811c9dc5;
  for (let i = 0; i < text.length; i++) h = Math.imul(h ^ text.charCodeAt(i), 0x01000193) >>> 0;
  return h.toString(36);
}

const columns = {
  slug: species.slug,
  botanicalName: species.botanicalName,
  commonNames: species.commonNames,
  synonyms: species.synonyms,
  genus: species.genus,
  group: species.group,
  flushHabit: species.flushHabit,
  vigour: species.vigour,
  needleMinMm: species.needleMinMm,
  needleMaxMm: species.needleMaxMm,
  publishedRevision: species.publishedRevision,
  latestRevision: species.latestRevision,
};

interface Row {
  slug: string;
  botanicalName: string;
  commonNames: string[];
  synonyms: string[];
  genus: string;
  group: string;
  flushHabit: FlushHabit | null;
  vigour: 'low' | 'moderate' | 'high' | null;
  needleMinMm: number | null;
  needleMaxMm: number | null;
  publishedRevision: number | null;
  latestRevision: number;
}

/**
 * Species for the list and search. Members and visitors see published species only; editors
 * also see species that have only drafts, and which species carry an unpublished draft.
 * Without `q` the order is by botanical name with a keyset cursor in SQL; with `q` it is by
 * fuzzy-search score (best first) with the cursor holding the last score and name.
 */
export async function listSpecies(viewer: SessionUser | null, query: SpeciesListQuery): Promise<SpeciesListPage> {
  const editor = !!viewer && hasRole(viewer.role, 'editor');
  const db = await getDb();
  const where: (SQL | undefined)[] = [];
  if (!editor) where.push(isNotNull(species.publishedRevision));
  if (query.group) where.push(eq(species.group, query.group));
  if (query.flush) where.push(eq(species.flushHabit, query.flush));
  if (query.vigour) where.push(eq(species.vigour, query.vigour));
  // Needle length filters keep every species whose natural range overlaps the asked range.
  if (query.needleMin !== undefined) where.push(gte(species.needleMaxMm, query.needleMin));
  if (query.needleMax !== undefined) where.push(lte(species.needleMinMm, query.needleMax));

  const q = query.q?.trim();
  const limit = query.limit;
  const toItem = (r: Row, score?: number): SpeciesListItem => ({
    slug: r.slug,
    botanicalName: r.botanicalName,
    commonNames: r.commonNames,
    synonyms: r.synonyms,
    genus: r.genus,
    group: r.group,
    flushHabit: r.flushHabit,
    needleLengthMm: { min: r.needleMinMm, max: r.needleMaxMm },
    vigour: r.vigour,
    publishedRevision: r.publishedRevision,
    ...(editor ? { latestRevision: r.latestRevision, hasDraft: r.latestRevision !== (r.publishedRevision ?? 0) } : {}),
    ...(score !== undefined ? { score } : {}),
  });

  if (!q) {
    const cursor = decodeCursor(query.cursor, null);
    if (cursor) {
      where.push(or(gt(species.botanicalName, cursor.b), and(eq(species.botanicalName, cursor.b), gt(species.slug, cursor.s))));
    }
    const rows = await db
      .select(columns)
      .from(species)
      .where(and(...where))
      .orderBy(asc(species.botanicalName), asc(species.slug))
      .limit(limit + 1);
    const page = rows.slice(0, limit);
    const last = page[page.length - 1];
    return {
      items: page.map((r) => toItem(r)),
      nextCursor: rows.length > limit && last ? encodeCursor({ b: last.botanicalName, s: last.slug }) : null,
    };
  }

  // Search: rank every visible species (the index is cached until a species write), keep those
  // the filters allow, then page by keyset on (score, botanical name, slug). A score depends only on
  // the query and that species, so a cursor continues exactly where its page ended, in any process.
  const key = searchFingerprint(query);
  const cursor = decodeCursor(query.cursor, key);
  const { index } = await searchableSpecies(db, editor);
  const allowed = (r: Row) =>
    (!query.group || r.group === query.group) &&
    (!query.flush || r.flushHabit === query.flush) &&
    (!query.vigour || r.vigour === query.vigour) &&
    (query.needleMin === undefined || (r.needleMaxMm !== null && r.needleMaxMm >= query.needleMin)) &&
    (query.needleMax === undefined || (r.needleMinMm !== null && r.needleMinMm <= query.needleMax));
  let ranked = searchSpecies(index.items, q, index).filter((h) => allowed(h.item));
  if (cursor) {
    const mark = { score: cursor.sc!, item: { botanicalName: cursor.b, slug: cursor.s, commonNames: [], synonyms: [] } };
    ranked = ranked.filter((h) => compareHits(h, mark) > 0);
  }
  const page = ranked.slice(0, limit);
  const last = page[page.length - 1];
  return {
    items: page.map((h) => ({ ...toItem(h.item, h.score), match: { ...h.match, note: matchNote(h.match) } })),
    nextCursor: ranked.length > limit && last ? encodeCursor({ sc: last.score, b: last.item.botanicalName, s: last.item.slug, h: key }) : null,
  };
}

/** Every species the viewer's role may see, with its search index; rebuilt after any species write. */
function searchableSpecies(db: Awaited<ReturnType<typeof getDb>>, editor: boolean): Promise<{ index: SpeciesSearchIndex<Row> }> {
  return cachedRead(db, 'species', editor ? 'search:editor' : 'search:published', async () => {
    const rows = await db
      .select(columns)
      .from(species)
      .where(editor ? undefined : isNotNull(species.publishedRevision));
    rows.sort((a, b) => cmp(a.botanicalName, b.botanicalName) || cmp(a.slug, b.slug));
    return { index: buildSpeciesIndex(rows) };
  });
}

/** Every species the viewer may see, in name order (the /species table filters these as you type). */
export async function listAllSpecies(viewer: SessionUser | null): Promise<SpeciesListItem[]> {
  const out: SpeciesListItem[] = [];
  let cursor: string | undefined;
  do {
    const page = await listSpecies(viewer, { limit: 100, cursor });
    out.push(...page.items);
    cursor = page.nextCursor ?? undefined;
  } while (cursor);
  return out;
}
