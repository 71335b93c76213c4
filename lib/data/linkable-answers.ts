import 'server-only';
import { and, desc, eq, gte, ilike, lte, or, sql, type SQL } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { answers, species, trees, users } from '@/db/schema';
import { escapeLike } from '@/lib/data/users';
import type { SessionUser } from '@/lib/auth/session';
import type { LinkableAnswersQuery } from '@/lib/validation/notes';
import { assertRole } from '@/lib/auth/roles';

// The note editor's picker: answers shared with the club, searched by species, action, member
// and date. Private answers never appear here, whoever searches.

export interface LinkableAnswerDto {
  id: string;
  url: string;
  action: string;
  speciesSlug: string;
  speciesName: string;
  observedOn: string;
  askerName: string;
  /** The asker's tree the answer was about, if any: two answers on one day tell apart by it. */
  treeName: string | null;
  /** When it was saved (ISO), the last thing that tells two lookalike answers apart. */
  savedAt: string;
}

export async function searchLinkableAnswers(actor: Pick<SessionUser, 'role'>, q: LinkableAnswersQuery): Promise<LinkableAnswerDto[]> {
  assertRole(actor, 'librarian', 'notes', 'Only librarians and administrators write meeting notes.');
  const conds: (SQL | undefined)[] = [eq(answers.visibility, 'club')];
  if (q.species) {
    const like = `%${escapeLike(q.species)}%`;
    conds.push(or(ilike(answers.speciesSlug, like), ilike(species.botanicalName, like), sql`${species.commonNames}::text ilike ${like}`));
  }
  if (q.action) conds.push(eq(answers.action, q.action));
  if (q.member) conds.push(ilike(users.name, `%${escapeLike(q.member)}%`));
  if (q.from) conds.push(gte(answers.observedOn, q.from));
  if (q.to) conds.push(lte(answers.observedOn, q.to));
  const db = await getDb();
  const rows = await db
    .select({
      id: answers.id,
      action: answers.action,
      speciesSlug: answers.speciesSlug,
      botanicalName: species.botanicalName,
      commonNames: species.commonNames,
      observedOn: answers.observedOn,
      askerName: users.name,
      treeName: trees.name,
      createdAt: answers.createdAt,
    })
    .from(answers)
    .innerJoin(users, eq(users.id, answers.userId))
    .leftJoin(species, eq(species.slug, answers.speciesSlug))
    .leftJoin(trees, eq(trees.id, answers.treeId))
    .where(and(...conds))
    .orderBy(desc(answers.observedOn), desc(answers.createdAt))
    .limit(30);
  return rows.map((r) => ({
    id: r.id,
    url: `/answers/${r.id}`,
    action: r.action,
    speciesSlug: r.speciesSlug,
    speciesName: r.commonNames?.[0] ?? r.botanicalName ?? r.speciesSlug,
    observedOn: r.observedOn,
    askerName: r.askerName?.trim() || 'A club member',
    treeName: r.treeName?.trim() || null,
    savedAt: r.createdAt.toISOString(),
  }));
}
