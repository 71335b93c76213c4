import { describe, expect, it } from 'vitest';
import { memoryDb } from '../support/memory-db';
import { count, eq } from 'drizzle-orm';
import { seed } from '@/db/seed';
import { answers, noteLinks, notes, trees, users } from '@/db/schema';
import { demoAnswerId, demoNoteSlug, demoTreeIds } from '@/db/seed-record';
import { getBacklinks } from '@/lib/data/notes';
import { renderNoteBody } from '@/lib/data/note-render';

const mem = memoryDb();

async function counts() {
  const [t] = await mem.db.select({ n: count() }).from(trees);
  const [a] = await mem.db.select({ n: count() }).from(answers);
  const [n] = await mem.db.select({ n: count() }).from(notes);
  const [l] = await mem.db.select({ n: count() }).from(noteLinks);
  return { trees: t.n, answers: a.n, notes: n.n, links: l.n };
}

describe('demo club record seeder', () => {
  it('gives the demo member two trees and a shared answer about the first', async () => {
    const [member] = await mem.db.select({ id: users.id }).from(users).where(eq(users.email, 'member@candlewise.test'));
    const mine = await mem.db.select({ id: trees.id, name: trees.name }).from(trees).where(eq(trees.ownerId, member.id));
    expect(mine.map((t) => t.id).sort()).toEqual([demoTreeIds.mugo, demoTreeIds.scots].sort());
    const [a] = await mem.db
      .select({ treeId: answers.treeId, visibility: answers.visibility, action: answers.action })
      .from(answers)
      .where(eq(answers.id, demoAnswerId));
    // common practice, no published source: an extending candle beyond the silhouette in refinement is pinched
    expect(a).toEqual({ treeId: demoTreeIds.scots, visibility: 'club', action: 'pinch' });
  });

  it('publishes a note whose links are recorded and render as cards', async () => {
    expect((await getBacklinks('answer', demoAnswerId)).map((b) => b.slug)).toEqual([demoNoteSlug]);
    expect((await getBacklinks('species', 'pinus-sylvestris')).map((b) => b.slug)).toEqual([demoNoteSlug]);
    const [n] = await mem.db.select({ body: notes.body }).from(notes).where(eq(notes.slug, demoNoteSlug));
    const html = await renderNoteBody(n.body);
    expect(html).toContain('asked by Wren Alder');
    expect(html).toContain('Japanese black pine (Pinus thunbergii) · double flush');
  });

  it('is idempotent', async () => {
    const before = await counts();
    await seed(mem.db);
    expect(await counts()).toEqual(before);
  });
});
