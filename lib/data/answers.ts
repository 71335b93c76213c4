import 'server-only';
import { photoFilesOfAnswer, removeStoredFiles } from '@/lib/data/photos';
import { and, eq, or, sql, type SQL } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { answers, trees, users } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { isBoundedDate } from '@/lib/validation/bounds';
import { answerIdPattern, newAnswerId } from '@/lib/ids';
import { assertAnswerQuota } from '@/lib/data/quotas';
import type { SessionUser } from '@/lib/auth/session';
import type { PhoneResult, SaveAnswerWithPhoneBody } from '@/lib/validation/offline';
import type { Action, WizardInput, WizardResult } from '@/lib/wizard/types';
import { compareResults, type ResultComparison } from '@/lib/wizard/compare';
import { runWizard } from './wizard';
import { answerRowFromResult } from './answer-row';

// The answer log. Every read is scoped in the query itself: the owner sees their answers, any
// signed-in member sees answers shared with the club, and nobody else learns that an id exists.

type Viewer = Pick<SessionUser, 'id'> | null;

// The generator and the pattern live in lib/ids.ts with every other id's; re-exported here.
export { newAnswerId } from '@/lib/ids';

export interface AnswerDto {
  id: string;
  url: string;
  speciesSlug: string;
  speciesName: string;
  speciesRevision: number;
  engineVersion: string;
  action: Action;
  stage: string;
  season: string;
  observedOn: string;
  treeId: string | null;
  input: WizardInput;
  result: WizardResult;
  note: string;
  followUp: string;
  visibility: 'private' | 'club';
  createdAt: string;
  askerName: string;
  isOwner: boolean;
  /** What a phone worked out offline, kept only when the server's answer differs. */
  phoneResult: PhoneResult | null;
}

export interface AnswerListItem {
  id: string;
  url: string;
  speciesSlug: string;
  speciesName: string;
  action: Action;
  stage: string;
  season: string;
  observedOn: string;
  headline: string;
  note: string;
  followUp: string;
  visibility: 'private' | 'club';
  createdAt: string;
  askerName: string;
}

const answerUrl = (id: string) => `/answers/${id}`;
const asker = (name: string | null) => name?.trim() || 'A club member';

function visibleTo(viewer: Viewer) {
  if (!viewer) return sql`false`;
  return or(eq(answers.userId, viewer.id), eq(answers.visibility, 'club'))!;
}

export type SavedAnswer = { id: string; url: string; phoneResult: PhoneResult | null } & WizardResult;

/**
 * Evaluate and save. With an idempotency key, a repeat of the same save (an offline queue
 * replaying, a retry after a lost response) returns the first answer with `created: false`
 * instead of writing a second one. The phone's own result is kept only when it differs.
 */
export async function saveAnswerOnce(
  user: SessionUser,
  body: SaveAnswerWithPhoneBody,
  opts: { idempotencyKey?: string } = {},
): Promise<{ created: boolean; answer: SavedAnswer }> {
  const { treeId, note, visibility, phoneResult, ...input } = body;
  const db = await getDb();
  const key = opts.idempotencyKey;
  if (key) {
    const first = await answerByKey(user.id, key);
    if (first) return { created: false, answer: first };
  }
  if (treeId) {
    const [tree] = await db
      .select({ id: trees.id })
      .from(trees)
      .where(and(eq(trees.id, treeId), eq(trees.ownerId, user.id)))
      .limit(1);
    if (!tree) throw new AppError('bad_request:treeId', 'That tree is not one of yours.', { treeId: ['Unknown tree'] });
  }
  await assertAnswerQuota(user.id);
  const { result } = await runWizard(input);
  const differs = phoneResult ? phoneDiffers(phoneResult, result) : false;
  const id = newAnswerId();
  // createdAt set here at millisecond precision, so the keyset cursor round-trips exactly.
  const inserted = await db
    .insert(answers)
    .values({
      id,
      userId: user.id,
      treeId: treeId ?? null,
      ...answerRowFromResult(input, result),
      note: note ?? '',
      visibility: visibility ?? 'private',
      createdAt: new Date(),
      idempotencyKey: key ?? null,
      phoneResult: differs ? phoneResult : null,
    })
    // Two copies of one save racing each other: the unique (user, key) index lets one in.
    .onConflictDoNothing()
    .returning({ id: answers.id });
  if (!inserted.length && key) {
    const first = await answerByKey(user.id, key);
    if (first) return { created: false, answer: first };
  }
  return { created: true, answer: { id, url: answerUrl(id), phoneResult: differs ? phoneResult! : null, ...result } };
}

/** Evaluate and save without a key: always a new answer. */
export async function saveAnswer(user: SessionUser, body: SaveAnswerWithPhoneBody): Promise<SavedAnswer> {
  return (await saveAnswerOnce(user, body)).answer;
}

/** The phone's answer differs when it would have the member do something else, or for other reasons. */
export function phoneDiffers(phone: PhoneResult, server: WizardResult): boolean {
  if (phone.action !== server.action || phone.engineVersion !== server.engineVersion || phone.speciesRevision !== server.speciesRevision) return true;
  const rules = (rs: { rule: string }[]) =>
    rs
      .map((r) => r.rule)
      .sort()
      .join(' ');
  return rules(phone.reasons) !== rules(server.reasons);
}

async function answerByKey(userId: string, key: string): Promise<SavedAnswer | null> {
  const db = await getDb();
  const [r] = await db
    .select({ id: answers.id, result: answers.result, phoneResult: answers.phoneResult })
    .from(answers)
    .where(and(eq(answers.userId, userId), eq(answers.idempotencyKey, key)))
    .limit(1);
  if (!r) return null;
  return { id: r.id, url: answerUrl(r.id), phoneResult: r.phoneResult ?? null, ...r.result };
}

function encodeCursor(createdAt: Date, id: string) {
  return Buffer.from(`${createdAt.toISOString()}|${id}`).toString('base64url');
}

function decodeCursor(cursor: string): { createdAt: Date; id: string } {
  const raw = Buffer.from(cursor, 'base64url').toString('utf8');
  const [iso, id] = raw.split('|');
  const createdAt = new Date(iso);
  if (!id || !isBoundedDate(createdAt) || !answerIdPattern.test(id)) {
    throw new AppError('bad_request:cursor', 'The page cursor is not valid.', { cursor: ['Invalid cursor'] });
  }
  return { createdAt, id };
}

/** The user's own answers, newest first, keyset-paginated. */
export function listOwnAnswers(
  user: Pick<SessionUser, 'id'>,
  q: { cursor?: string; species?: string; action?: Action; limit?: number },
): Promise<{ items: AnswerListItem[]; nextCursor: string | null }> {
  return listAnswers(eq(answers.userId, user.id), q);
}

/** Answers shared with the club (anyone's), newest first: what librarians link into notes. */
export function listSharedAnswers(
  _viewer: Pick<SessionUser, 'id'>,
  q: { cursor?: string; species?: string; action?: Action; limit?: number },
): Promise<{ items: AnswerListItem[]; nextCursor: string | null }> {
  return listAnswers(eq(answers.visibility, 'club'), q);
}

async function listAnswers(
  scope: SQL,
  q: { cursor?: string; species?: string; action?: Action; limit?: number },
): Promise<{ items: AnswerListItem[]; nextCursor: string | null }> {
  const limit = q.limit ?? 20;
  const conds = [scope];
  if (q.species) conds.push(eq(answers.speciesSlug, q.species));
  if (q.action) conds.push(eq(answers.action, q.action));
  if (q.cursor) {
    const c = decodeCursor(q.cursor);
    conds.push(sql`(${answers.createdAt}, ${answers.id}) < (${c.createdAt.toISOString()}::timestamptz, ${c.id})`);
  }
  const db = await getDb();
  const rows = await db
    .select({
      id: answers.id,
      speciesSlug: answers.speciesSlug,
      action: answers.action,
      stage: answers.stage,
      season: answers.season,
      observedOn: answers.observedOn,
      note: answers.note,
      followUp: answers.followUp,
      visibility: answers.visibility,
      createdAt: answers.createdAt,
      askerName: users.name,
      // Two fields of the stored result, not the whole document: a list page read and parsed
      // every answer's full result only to show these (the signed-in benchmark found it).
      speciesName: sql<string | null>`${answers.result}->>'speciesName'`,
      headline: sql<string | null>`${answers.result}->>'headline'`,
    })
    .from(answers)
    .innerJoin(users, eq(users.id, answers.userId))
    .where(and(...conds))
    // NULLS LAST as in the indexes (drizzle writes `.desc()` index columns as DESC NULLS LAST):
    // a plain DESC means NULLS FIRST, which no index provides, so every page sorted the whole
    // history (found by the data-growth benchmark). The columns are NOT NULL; the order is the same.
    .orderBy(sql`${answers.createdAt} desc nulls last`, sql`${answers.id} desc nulls last`)
    .limit(limit + 1);
  const page = rows.slice(0, limit);
  const items = page.map((r) => {
    return {
      id: r.id,
      url: answerUrl(r.id),
      speciesSlug: r.speciesSlug,
      speciesName: r.speciesName ?? r.speciesSlug,
      action: r.action as Action,
      stage: r.stage,
      season: r.season,
      observedOn: r.observedOn,
      headline: r.headline ?? r.action,
      note: r.note,
      followUp: r.followUp,
      visibility: r.visibility,
      createdAt: r.createdAt.toISOString(),
      askerName: asker(r.askerName),
    };
  });
  const last = page[page.length - 1];
  return { items, nextCursor: rows.length > limit && last ? encodeCursor(last.createdAt, last.id) : null };
}

/** One answer, if the viewer may see it (owner, or shared with the club); otherwise null. */
export async function getAnswer(id: string, viewer: Viewer): Promise<AnswerDto | null> {
  if (!answerIdPattern.test(id) || !viewer) return null;
  const db = await getDb();
  const [r] = await db
    .select({
      id: answers.id,
      userId: answers.userId,
      treeId: answers.treeId,
      speciesSlug: answers.speciesSlug,
      speciesRevision: answers.speciesRevision,
      engineVersion: answers.engineVersion,
      action: answers.action,
      stage: answers.stage,
      season: answers.season,
      observedOn: answers.observedOn,
      input: answers.input,
      result: answers.result,
      note: answers.note,
      followUp: answers.followUp,
      visibility: answers.visibility,
      createdAt: answers.createdAt,
      askerName: users.name,
      phoneResult: answers.phoneResult,
    })
    .from(answers)
    .innerJoin(users, eq(users.id, answers.userId))
    .where(and(eq(answers.id, id), visibleTo(viewer)))
    .limit(1);
  if (!r) return null;
  const result = r.result;
  return {
    id: r.id,
    url: answerUrl(r.id),
    speciesSlug: r.speciesSlug,
    speciesName: result.speciesName ?? r.speciesSlug,
    speciesRevision: r.speciesRevision,
    engineVersion: r.engineVersion,
    action: r.action as Action,
    stage: r.stage,
    season: r.season,
    observedOn: r.observedOn,
    treeId: r.userId === viewer.id ? r.treeId : null,
    input: r.input,
    result,
    note: r.note,
    followUp: r.followUp,
    visibility: r.visibility,
    createdAt: r.createdAt.toISOString(),
    askerName: asker(r.askerName),
    isOwner: r.userId === viewer.id,
    phoneResult: r.phoneResult ?? null,
  };
}

/** Owner-only changes. Someone who can see a shared answer but does not own it gets 403; anyone else 404. */
export async function updateAnswer(
  user: Pick<SessionUser, 'id'>,
  id: string,
  patch: { followUp?: string; note?: string; visibility?: 'private' | 'club'; treeId?: string | null },
): Promise<AnswerDto> {
  const db = await getDb();
  // Only your own answer, and only to your own tree: someone else's tree reads like a missing one.
  if (patch.treeId && answerIdPattern.test(id)) {
    const [own] = await db
      .select({ id: answers.id })
      .from(answers)
      .where(and(eq(answers.id, id), eq(answers.userId, user.id)))
      .limit(1);
    if (!own) await refuse(id, user);
    const [tree] = await db
      .select({ id: trees.id })
      .from(trees)
      .where(and(eq(trees.id, patch.treeId), eq(trees.ownerId, user.id)))
      .limit(1);
    if (!tree) throw new AppError('bad_request:treeId', 'That tree is not one of yours.', { treeId: ['Unknown tree'] });
  }
  const rows = answerIdPattern.test(id)
    ? await db
        .update(answers)
        .set(patch)
        .where(and(eq(answers.id, id), eq(answers.userId, user.id)))
        .returning({ id: answers.id })
    : [];
  if (!rows.length) await refuse(id, user);
  return (await getAnswer(id, user))!;
}

export async function deleteAnswer(user: Pick<SessionUser, 'id'>, id: string): Promise<void> {
  const db = await getDb();
  // The photo rows go with the answer (cascade); their files are read first and removed after.
  const files = answerIdPattern.test(id) ? await photoFilesOfAnswer(user, id) : [];
  const rows = answerIdPattern.test(id)
    ? await db
        .delete(answers)
        .where(and(eq(answers.id, id), eq(answers.userId, user.id)))
        .returning({ id: answers.id })
    : [];
  if (!rows.length) await refuse(id, user);
  await removeStoredFiles(files);
}

async function refuse(id: string, user: Pick<SessionUser, 'id'>): Promise<never> {
  const visible = await getAnswer(id, user);
  if (visible) throw new AppError('forbidden:answer', 'Only the person who asked can change this answer.');
  throw new AppError('not_found:answer', 'No such answer.');
}

export interface RerunDto {
  answerId: string;
  stored: WizardResult;
  current: WizardResult | null;
  comparison: ResultComparison | null;
  speciesMissing: boolean;
}

/** Re-run a stored answer's inputs with today's engine and species data, and compare. */
export async function rerunAnswer(id: string, viewer: Viewer): Promise<RerunDto | null> {
  const a = await getAnswer(id, viewer);
  if (!a) return null;
  try {
    const { result } = await runWizard(a.input);
    return { answerId: a.id, stored: a.result, current: result, comparison: compareResults(a.result, result), speciesMissing: false };
  } catch (e) {
    if (e instanceof AppError && e.kind === 'not_found') {
      return { answerId: a.id, stored: a.result, current: null, comparison: null, speciesMissing: true };
    }
    throw e;
  }
}

export interface AnswerPreview {
  id: string;
  action: Action;
  speciesSlug: string;
  speciesName: string;
  observedOn: string;
  askerName: string;
}

/** For answer links in notes and trees: a small preview, or null when missing or not visible. */
export async function getAnswerPreview(id: string, viewer: Viewer): Promise<AnswerPreview | null> {
  if (!answerIdPattern.test(id) || !viewer) return null;
  const db = await getDb();
  const [r] = await db
    .select({
      id: answers.id,
      action: answers.action,
      speciesSlug: answers.speciesSlug,
      observedOn: answers.observedOn,
      speciesName: sql<string | null>`${answers.result} ->> 'speciesName'`,
      askerName: users.name,
    })
    .from(answers)
    .innerJoin(users, eq(users.id, answers.userId))
    .where(and(eq(answers.id, id), visibleTo(viewer)))
    .limit(1);
  if (!r) return null;
  return {
    id: r.id,
    action: r.action as Action,
    speciesSlug: r.speciesSlug,
    speciesName: r.speciesName ?? r.speciesSlug,
    observedOn: r.observedOn,
    askerName: asker(r.askerName),
  };
}
