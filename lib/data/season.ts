import 'server-only';
import { and, asc, desc, eq, gte, lte, sql } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { announceInvalidation } from '@/lib/data/invalidation';
import { cachedRead } from '@/lib/data/read-cache';
import { answers, temperatureDays, temperatureRecords, treeObservations } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { newPublicId } from '@/lib/ids';
import { hasRole } from '@/lib/auth/roles';
import type { SessionUser } from '@/lib/auth/session';
import { accumulate, addDays, type DayTemps } from '@/lib/season/degree-days';
import { parseTemperatureCsv, type ParsedTemperatures } from '@/lib/season/temperature-csv';
import { seasonStart } from '@/lib/season/thermal';
import type { PlanObservation, PlanRecord, PlanTask } from '@/lib/season/plan';
import type { ShootState } from '@/lib/wizard/types';

// Temperature records (club-wide, kept by a librarian or an admin; or a member's own) and the
// observations a member records on a tree. Scoped in the queries: a member's record and
// observations are only ever read for that member.

export type RecordScope = 'club' | 'member';

const scopeKeyOf = (actor: SessionUser, scope: RecordScope) => (scope === 'club' ? 'club' : `member:${actor.id}`);

function assertMayWrite(actor: SessionUser, scope: RecordScope) {
  if (scope === 'club' && !hasRole(actor.role, 'librarian')) {
    throw new AppError('forbidden:temperature_record', 'Only a librarian or an administrator keeps the club’s temperature record.');
  }
}

export interface ImportPreview {
  format: ParsedTemperatures['format'];
  station: string | null;
  dayCount: number;
  firstDay: string | null;
  lastDay: string | null;
  /** Days already in the record that this import would replace. */
  replaces: number;
  heatSum: number;
  errors: ParsedTemperatures['errors'];
  skipped: ParsedTemperatures['skipped'];
  sample: DayTemps[];
}

async function recordId(scopeKey: string): Promise<string | null> {
  const db = await getDb();
  const [row] = await db.select({ id: temperatureRecords.id }).from(temperatureRecords).where(eq(temperatureRecords.scopeKey, scopeKey)).limit(1);
  return row?.id ?? null;
}

export async function previewImport(actor: SessionUser, scope: RecordScope, csv: string): Promise<ImportPreview> {
  assertMayWrite(actor, scope);
  const parsed = parseTemperatureCsv(csv);
  const first = parsed.days[0]?.date ?? null;
  const last = parsed.days.at(-1)?.date ?? null;
  let replaces = 0;
  const id = await recordId(scopeKeyOf(actor, scope));
  if (id && first && last) {
    const db = await getDb();
    const have = new Set(
      (
        await db
          .select({ day: temperatureDays.day })
          .from(temperatureDays)
          .where(and(eq(temperatureDays.recordId, id), gte(temperatureDays.day, first), lte(temperatureDays.day, last)))
      ).map((r) => r.day),
    );
    replaces = parsed.days.filter((d) => have.has(d.date)).length;
  }
  return {
    format: parsed.format,
    station: parsed.station,
    dayCount: parsed.days.length,
    firstDay: first,
    lastDay: last,
    replaces,
    heatSum: accumulate(parsed.days).total,
    errors: parsed.errors,
    skipped: parsed.skipped,
    sample: parsed.days.slice(0, 10),
  };
}

/** Write the days (replacing the same days); refused with the row errors if the file has any. */
export async function importRecord(actor: SessionUser, scope: RecordScope, csv: string): Promise<{ imported: number; replaced: number }> {
  const preview = await previewImport(actor, scope, csv);
  if (preview.errors.length) {
    const fields: Record<string, string[]> = {};
    for (const e of preview.errors.slice(0, 50)) (fields[`csv.line.${e.line}`] ??= []).push(e.message);
    throw new AppError(
      'invalid:csv',
      `The file has ${preview.errors.length} row error${preview.errors.length === 1 ? '' : 's'}; nothing was imported.`,
      fields,
    );
  }
  const days = parseTemperatureCsv(csv).days;
  const db = await getDb();
  const scopeKey = scopeKeyOf(actor, scope);
  await db.transaction(async (tx) => {
    await tx
      .insert(temperatureRecords)
      .values({ id: newPublicId(), scopeKey, ownerId: scope === 'club' ? null : actor.id, name: scope === 'club' ? 'Club record' : 'My record' })
      .onConflictDoUpdate({ target: temperatureRecords.scopeKey, set: { updatedAt: new Date() } });
    const [rec] = await tx.select({ id: temperatureRecords.id }).from(temperatureRecords).where(eq(temperatureRecords.scopeKey, scopeKey)).limit(1);
    for (let i = 0; i < days.length; i += 500) {
      await tx
        .insert(temperatureDays)
        .values(days.slice(i, i + 500).map((d) => ({ recordId: rec.id, day: d.date, tmin: d.tmin, tmax: d.tmax })))
        .onConflictDoUpdate({ target: [temperatureDays.recordId, temperatureDays.day], set: { tmin: sql`excluded.tmin`, tmax: sql`excluded.tmax` } });
    }
  });
  // Plans read the records through the read cache: drop them here and in every other process.
  await announceInvalidation({ kind: 'temperatures' });
  return { imported: days.length, replaced: preview.replaces };
}

async function daysOf(id: string, from?: string, to?: string): Promise<DayTemps[]> {
  const db = await getDb();
  const conds = [eq(temperatureDays.recordId, id)];
  if (from) conds.push(gte(temperatureDays.day, from));
  if (to) conds.push(lte(temperatureDays.day, to));
  const rows = await db
    .select({ date: temperatureDays.day, tmin: temperatureDays.tmin, tmax: temperatureDays.tmax })
    .from(temperatureDays)
    .where(and(...conds))
    .orderBy(asc(temperatureDays.day));
  return rows;
}

export interface RecordSummary {
  scope: RecordScope;
  dayCount: number;
  firstDay: string | null;
  lastDay: string | null;
  /** Heat sum by season year, one point per week: [{ year, points: [{ day, gdd }] }]. */
  years: { year: number; total: number; points: { day: number; gdd: number }[] }[];
}

/** The club record and the actor's own, summarised for the chart. */
export async function listRecords(actor: SessionUser, hemisphere: 'north' | 'south'): Promise<RecordSummary[]> {
  const out: RecordSummary[] = [];
  for (const scope of ['club', 'member'] as const) {
    const id = await recordId(scopeKeyOf(actor, scope));
    if (!id) continue;
    const days = await daysOf(id);
    const byYear = new Map<number, DayTemps[]>();
    for (const d of days) {
      const start = seasonStart(d.date, hemisphere);
      const y = Number(start.slice(0, 4));
      (byYear.get(y) ?? byYear.set(y, []).get(y)!).push(d);
    }
    const years = [...byYear.entries()]
      .sort(([a], [b]) => a - b)
      .map(([year, ds]) => {
        const start = `${year}-${hemisphere === 'north' ? '01-01' : '07-01'}`;
        const sum = accumulate(ds);
        const points = sum.cumulative
          .map((c) => ({ day: Math.round((Date.parse(c.date) - Date.parse(start)) / 86_400_000), gdd: c.gdd }))
          .filter((p, i, all) => p.day % 7 === 0 || i === all.length - 1);
        return { year, total: sum.total, points };
      });
    out.push({ scope, dayCount: days.length, firstDay: days[0]?.date ?? null, lastDay: days.at(-1)?.date ?? null, years });
  }
  return out;
}

/** The record that covers a member's trees: their own if they keep one, else the club's. */
/**
 * The record a member's plans read: their own, else the club's; this season so far and up to ten
 * earlier ones. Up to 3 650 days, read by every plan and "This week": kept in the read cache
 * (importRecord drops it), so a cached value is one object that the plan memo
 * (lib/data/plan.ts) can recognise.
 */
export async function planRecordFor(actor: Pick<SessionUser, 'id'>, today: string, hemisphere: 'north' | 'south'): Promise<PlanRecord | null> {
  const db = await getDb();
  return cachedRead(db, 'temperatures', `${actor.id}:${today}:${hemisphere}`, () => loadPlanRecord(actor, today, hemisphere));
}

async function loadPlanRecord(actor: Pick<SessionUser, 'id'>, today: string, hemisphere: 'north' | 'south'): Promise<PlanRecord | null> {
  const id = (await recordId(`member:${actor.id}`)) ?? (await recordId('club'));
  if (!id) return null;
  const start = seasonStart(today, hemisphere);
  const all = await daysOf(id, addDays(start, -365 * 10), today);
  const thisYear = all.filter((d) => d.date >= start);
  const earlierYears: DayTemps[][] = [];
  for (let k = 1; k <= 10; k++) {
    const from = `${Number(start.slice(0, 4)) - k}${start.slice(4)}`;
    const to = addDays(`${Number(start.slice(0, 4)) - k + 1}${start.slice(4)}`, -1);
    const ys = all.filter((d) => d.date >= from && d.date <= to);
    if (ys.length) earlierYears.push(ys);
  }
  if (!thisYear.length && !earlierYears.length) return null;
  return { thisYear, earlierYears };
}

/** Observations of one tree (the caller has checked ownership): its own and its saved answers' shoot states. */
export async function observationsOf(ownerId: string, treeId: string): Promise<PlanObservation[]> {
  const db = await getDb();
  const own = await db
    .select({ date: treeObservations.observedOn, shoot: treeObservations.shoot, task: treeObservations.task })
    .from(treeObservations)
    .where(and(eq(treeObservations.treeId, treeId), eq(treeObservations.ownerId, ownerId)))
    .orderBy(asc(treeObservations.observedOn))
    .limit(1000);
  const saved = await db
    .select({ date: answers.observedOn, input: answers.input })
    .from(answers)
    .where(and(eq(answers.treeId, treeId), eq(answers.userId, ownerId)))
    .orderBy(desc(answers.observedOn))
    .limit(200);
  return [
    ...own.map((o) => ({ date: o.date, shoot: (o.shoot ?? undefined) as ShootState | undefined, task: (o.task ?? undefined) as PlanTask | undefined })),
    ...saved.flatMap((a) => (typeof a.input.shoot === 'string' ? [{ date: a.date, shoot: a.input.shoot as ShootState }] : [])),
  ];
}

export async function addObservation(ownerId: string, treeId: string, o: { date: string; shoot?: ShootState; task?: PlanTask }) {
  const db = await getDb();
  const [{ count }] = await db
    .select({ count: sql<number>`count(*)::int` })
    .from(treeObservations)
    .where(eq(treeObservations.treeId, treeId));
  if (count >= 1000) throw new AppError('conflict:observation_limit', 'A tree keeps up to 1000 observations.');
  await db.insert(treeObservations).values({ treeId, ownerId, observedOn: o.date, shoot: o.shoot ?? null, task: o.task ?? null });
}
