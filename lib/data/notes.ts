import 'server-only';
import { and, desc, eq, ilike, or, sql, type SQL } from 'drizzle-orm';
import { getDb, type Db } from '@/db/client';
import { noteLinks, notes, users } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { hasRole } from '@/lib/auth/roles';
import { escapeLike } from '@/lib/data/users';
import { extractInternalLinks } from '@/lib/markdown/render';
import type { SessionUser } from '@/lib/auth/session';
import { noteSlugFor, type NoteInput, type NotePatch, type NoteStatus } from '@/lib/validation/notes';
import { assertRole } from '@/lib/auth/roles';

// Meeting notes. Librarians and admins write them and see drafts; every other signed-in member
// reads published notes only, and a draft answers them exactly like a note that does not exist.

export interface NoteSummaryDto {
  slug: string;
  title: string;
  meetingDate: string;
  status: NoteStatus;
  authorName: string;
  updatedAt: string;
  publishedAt: string | null;
}

export interface NoteDto extends NoteSummaryDto {
  id: number;
  body: string;
  createdAt: string;
}

export interface BacklinkDto {
  slug: string;
  title: string;
  meetingDate: string;
}

type Viewer = Pick<SessionUser, 'id' | 'role'>;
type Tx = Db | Parameters<Parameters<Db['transaction']>[0]>[0];

export const canWriteNotes = (viewer: Pick<SessionUser, 'role'> | null) => !!viewer && hasRole(viewer.role, 'librarian');

function requireWriter(actor: Viewer) {
  assertRole(actor, 'librarian', 'notes', 'Only librarians and administrators write meeting notes.');
}

const noteNotFound = () => new AppError('not_found:note', 'No such note.');

const summaryColumns = {
  slug: notes.slug,
  title: notes.title,
  meetingDate: notes.meetingDate,
  status: notes.status,
  authorName: users.name,
  updatedAt: notes.updatedAt,
  publishedAt: notes.publishedAt,
};

type SummaryRow = {
  slug: string;
  title: string;
  meetingDate: string;
  status: NoteStatus;
  authorName: string | null;
  updatedAt: Date;
  publishedAt: Date | null;
};

const toSummary = (r: SummaryRow): NoteSummaryDto => ({
  slug: r.slug,
  title: r.title,
  meetingDate: r.meetingDate,
  status: r.status,
  authorName: r.authorName?.trim() || 'A former member',
  updatedAt: r.updatedAt.toISOString(),
  publishedAt: r.publishedAt?.toISOString() ?? null,
});

/** What the viewer may see at all: writers every note, others published ones. */
function visibleTo(viewer: Viewer): SQL | undefined {
  return canWriteNotes(viewer) ? undefined : eq(notes.status, 'published');
}

export async function listNotes(viewer: Viewer, opts: { q?: string; status?: NoteStatus } = {}): Promise<NoteSummaryDto[]> {
  const db = await getDb();
  const conds: (SQL | undefined)[] = [visibleTo(viewer)];
  if (opts.status) conds.push(eq(notes.status, opts.status));
  const q = opts.q?.trim();
  if (q) {
    const like = `%${escapeLike(q)}%`;
    conds.push(or(ilike(notes.title, like), ilike(notes.body, like), ilike(users.name, like)));
  }
  const rows = await db
    .select(summaryColumns)
    .from(notes)
    .leftJoin(users, eq(users.id, notes.authorId))
    .where(and(...conds))
    .orderBy(desc(notes.meetingDate), desc(notes.id))
    .limit(500);
  return rows.map(toSummary);
}

export async function getNote(viewer: Viewer, slug: string): Promise<NoteDto> {
  const db = await getDb();
  const [r] = await db
    .select({ ...summaryColumns, id: notes.id, body: notes.body, createdAt: notes.createdAt })
    .from(notes)
    .leftJoin(users, eq(users.id, notes.authorId))
    .where(and(eq(notes.slug, slug), visibleTo(viewer)))
    .limit(1);
  if (!r) throw noteNotFound();
  return { ...toSummary(r), id: r.id, body: r.body, createdAt: r.createdAt.toISOString() };
}

/** Rewrite the note's rows in note_links from its body (inside the caller's transaction). */
export async function rewriteNoteLinks(tx: Tx, noteId: number, body: string): Promise<void> {
  await tx.delete(noteLinks).where(eq(noteLinks.noteId, noteId));
  const links = extractInternalLinks(body);
  if (links.length === 0) return;
  await tx
    .insert(noteLinks)
    .values(links.map((l) => ({ noteId, targetType: l.type, targetId: l.type === 'answer' ? l.id : l.slug })))
    .onConflictDoNothing();
  await syncNoteLinkCopies(tx, noteId);
}

/** Copy the note's meeting date and published state onto its links (the backlinks index reads them). */
async function syncNoteLinkCopies(tx: Tx, noteId: number): Promise<void> {
  await tx.execute(sql`
    update ${noteLinks} set meeting_date = n.meeting_date, published = (n.status = 'published')
    from ${notes} n where n.id = ${noteLinks.noteId} and ${noteLinks.noteId} = ${noteId}`);
}

async function freeSlug(tx: Tx, base: string): Promise<string> {
  const taken = await tx
    .select({ slug: notes.slug })
    .from(notes)
    .where(or(eq(notes.slug, base), sql`${notes.slug} like ${`${escapeLike(base)}-%`}`));
  const set = new Set(taken.map((t) => t.slug));
  if (!set.has(base)) return base;
  for (let i = 2; ; i++) if (!set.has(`${base}-${i}`)) return `${base}-${i}`;
}

export async function createNote(actor: SessionUser, input: NoteInput): Promise<NoteDto> {
  requireWriter(actor);
  const db = await getDb();
  const slug = await db.transaction(async (tx) => {
    const slug = await freeSlug(tx, noteSlugFor(input.meetingDate, input.title));
    const now = new Date();
    const [row] = await tx
      .insert(notes)
      .values({ ...input, slug, authorId: actor.id, createdAt: now, updatedAt: now, publishedAt: input.status === 'published' ? now : null })
      .returning({ id: notes.id });
    await rewriteNoteLinks(tx, row.id, input.body);
    return slug;
  });
  return getNote(actor, slug);
}

export async function updateNote(actor: SessionUser, slug: string, patch: NotePatch): Promise<NoteDto> {
  requireWriter(actor);
  const { expectedUpdatedAt, ...fields } = patch;
  const db = await getDb();
  await db.transaction(async (tx) => {
    const [cur] = await tx
      .select({ id: notes.id, status: notes.status, updatedAt: notes.updatedAt, publishedAt: notes.publishedAt })
      .from(notes)
      .where(eq(notes.slug, slug))
      .for('update');
    if (!cur) throw noteNotFound();
    if (expectedUpdatedAt && new Date(expectedUpdatedAt).getTime() !== cur.updatedAt.getTime()) {
      throw new AppError('conflict:note', 'Someone saved this note after you opened it. Reload to see their changes, then edit again.');
    }
    const now = new Date();
    const publishing = fields.status === 'published' && cur.status !== 'published';
    const unpublishing = fields.status === 'draft';
    await tx
      .update(notes)
      .set({ ...fields, updatedAt: now, ...(publishing ? { publishedAt: now } : unpublishing ? { publishedAt: null } : {}) })
      .where(eq(notes.id, cur.id));
    if (fields.body !== undefined) await rewriteNoteLinks(tx, cur.id, fields.body);
    else await syncNoteLinkCopies(tx, cur.id);
  });
  // The slug stays as created, so links to the note keep working after a title change.
  return getNote(actor, slug);
}

export async function deleteNote(actor: SessionUser, slug: string): Promise<void> {
  requireWriter(actor);
  const db = await getDb();
  const rows = await db.delete(notes).where(eq(notes.slug, slug)).returning({ id: notes.id });
  if (!rows[0]) throw noteNotFound();
}

/** Published notes that link an answer (by id) or a species (by slug), latest meeting first. */
export async function getBacklinks(type: 'answer' | 'species', id: string): Promise<BacklinkDto[]> {
  const db = await getDb();
  return (
    db
      .select({ slug: notes.slug, title: notes.title, meetingDate: notes.meetingDate })
      .from(noteLinks)
      .innerJoin(notes, eq(notes.id, noteLinks.noteId))
      // By note_links_backlinks_idx: the newest hundred links in index order, then each note by its
      // key (the copies on note_links are kept in step with the note; its own status is checked too).
      .where(and(eq(noteLinks.targetType, type), eq(noteLinks.targetId, id), eq(noteLinks.published, true), eq(notes.status, 'published')))
      .orderBy(sql`${noteLinks.meetingDate} desc nulls last`, sql`${noteLinks.noteId} desc nulls last`)
      .limit(100)
  );
}
