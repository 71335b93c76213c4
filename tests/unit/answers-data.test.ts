import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { openDatabase, type DbHandle } from '@/db/open';
import { setDbHandle } from '@/db/client';
import { seed } from '@/db/seed';
import { trees, users } from '@/db/schema';
import { getAnswer, getAnswerPreview, listOwnAnswers, newAnswerId, rerunAnswer, saveAnswer, updateAnswer } from '@/lib/data/answers';
import { getTreePrefill } from '@/lib/data/wizard';
import type { SessionUser } from '@/lib/auth/session';

let handle: DbHandle;
let wren: SessionUser;
let tamsin: SessionUser;

const body = {
  species: 'pinus-sylvestris', branching: 'tertiary', date: '2027-05-10', shoot: 'candle-extending',
  position: 'beyond-silhouette', health: 'average',
} as const;

async function user(email: string): Promise<SessionUser> {
  const [u] = await handle.db.select({ id: users.id, name: users.name, email: users.email, role: users.role, tokenVersion: users.tokenVersion }).from(users).where(eq(users.email, email));
  return { ...u, name: u.name ?? '' };
}

beforeAll(async () => {
  handle = await openDatabase({ pgliteDir: 'memory' });
  setDbHandle(handle);
  await seed(handle.db);
  wren = await user('member@candlewise.test');
  tamsin = await user('member2@candlewise.test');
});
afterAll(() => handle?.close());

describe('answer ids', () => {
  it('are 12 url-safe characters and do not repeat', () => {
    const ids = new Set(Array.from({ length: 2000 }, newAnswerId));
    expect(ids.size).toBe(2000);
    for (const id of ids) expect(id).toMatch(/^[A-Za-z0-9_-]{12}$/);
  });
});

describe('answer previews for links', () => {
  it('shows a shared answer to another member and hides a private one', async () => {
    const priv = await saveAnswer(wren, { ...body });
    const shared = await saveAnswer(wren, { ...body, visibility: 'club' });
    expect(await getAnswerPreview(priv.id, tamsin)).toBeNull();
    expect(await getAnswerPreview(priv.id, null)).toBeNull();
    expect(await getAnswerPreview('AAAAAAAAAAAA', wren)).toBeNull();
    expect(await getAnswerPreview(priv.id, wren)).toMatchObject({ id: priv.id, action: 'pinch', speciesName: 'Scots pine', askerName: 'Wren Alder' });
    expect(await getAnswerPreview(shared.id, tamsin)).toEqual({
      id: shared.id, action: 'pinch', speciesSlug: 'pinus-sylvestris', speciesName: 'Scots pine', observedOn: '2027-05-10', askerName: 'Wren Alder',
    });
  });

  it('keeps the owner scope in updates', async () => {
    const a = await saveAnswer(wren, { ...body });
    await expect(updateAnswer(tamsin, a.id, { followUp: 'x' })).rejects.toMatchObject({ status: 404 });
    expect((await getAnswer(a.id, wren))!.followUp).toBe('');
    expect((await updateAnswer(wren, a.id, { followUp: 'pinched on 12 May' })).followUp).toBe('pinched on 12 May');
    expect(await rerunAnswer(a.id, tamsin)).toBeNull();
    expect((await rerunAnswer(a.id, wren))!.comparison!.same).toBe(true);
  });

  it('links an answer to the owner’s tree and pre-fills the wizard from it', async () => {
    await handle.db.insert(trees).values({ id: 'tree-w1', ownerId: wren.id, name: 'Riverside Scots', speciesSlug: 'pinus-sylvestris', containerShape: 'oval', containerLengthCm: 40, containerWidthCm: 30, collectedFromWild: true, collectedOn: '2026-04-01' });
    expect(await getTreePrefill('tree-w1', tamsin)).toBeNull();
    expect(await getTreePrefill('tree-w1', wren, '2027-05-10')).toMatchObject({ speciesSlug: 'pinus-sylvestris', container: { shape: 'oval', lengthCm: 40, widthCm: 30 }, recentlyCollected: true });
    expect((await getTreePrefill('tree-w1', wren, '2029-05-10'))!.recentlyCollected).toBe(false);
    await expect(saveAnswer(tamsin, { ...body, treeId: 'tree-w1' })).rejects.toMatchObject({ status: 400 });
    const a = await saveAnswer(wren, { ...body, treeId: 'tree-w1' });
    expect((await getAnswer(a.id, wren))!.treeId).toBe('tree-w1');
    const list = await listOwnAnswers(wren, { limit: 100 });
    expect(list.items[0].id).toBe(a.id);
    expect((await listOwnAnswers(tamsin, {})).items).toEqual([]);
  });
});
