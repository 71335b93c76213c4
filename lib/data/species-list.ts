import 'server-only';
import type { FlushHabit } from '@/lib/validation/species';
import { and, asc, eq, gt, gte, isNotNull, lte, or, type SQL } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { species } from '@/db/schema';
import { AppError } from '@/lib/errors';
import type { SessionUser } from '@/lib/auth/session';
import { hasRole } from '@/lib/auth/roles';
import { searchSpecies } from '@/lib/species/search';
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
  score?: number;
}

export interface SpeciesListPage {
  items: SpeciesListItem[];
  nextCursor: string | null;
}

type Cursor = { b: string; s: string; sc?: number };

function encodeCursor(c: Cursor) {
  return Buffer.from(JSON.stringify(c)).toString('base64url');
}

function decodeCursor(raw: string | undefined, withScore: boolean): Cursor | null {
  if (!raw) return null;
  try {
    const c = JSON.parse(Buffer.from(raw, 'base64url').toString('utf8')) as Cursor;
    if (typeof c.b !== 'string' || typeof c.s !== 'string') throw new Error('shape');
    if (withScore && typeof c.sc !== 'number') throw new Error('score');
    return c;
  } catch {
    throw new AppError('bad_request:cursor', 'The cursor is not valid: start again from the first page.', { cursor: ['Not a cursor this list gave out'] });
  }
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
    const cursor = decodeCursor(query.cursor, false);
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

  const cursor = decodeCursor(query.cursor, true);
  const rows = await db.select(columns).from(species).where(and(...where));
  let ranked = searchSpecies(rows, q);
  if (cursor) {
    const after = (x: { item: { botanicalName: string; slug: string }; score: number }) =>
      x.score > cursor.sc! ||
      (x.score === cursor.sc && (x.item.botanicalName.localeCompare(cursor.b) > 0 || (x.item.botanicalName === cursor.b && x.item.slug.localeCompare(cursor.s) > 0)));
    ranked = ranked.filter(after);
  }
  const page = ranked.slice(0, limit);
  const last = page[page.length - 1];
  return {
    items: page.map((r) => toItem(r.item, r.score)),
    nextCursor: ranked.length > limit && last ? encodeCursor({ b: last.item.botanicalName, s: last.item.slug, sc: last.score }) : null,
  };
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
