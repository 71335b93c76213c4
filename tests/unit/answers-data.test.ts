import { beforeAll, describe, expect, it } from 'vitest';
import { memoryDb } from '../support/memory-db';
import { trees } from '@/db/schema';
import {
  getAnswer,
  getAnswerPreview,
  listOwnAnswers,
  newAnswerId,
  phoneDiffers,
  rerunAnswer,
  saveAnswer,
  saveAnswerOnce,
  updateAnswer,
} from '@/lib/data/answers';
import { getTreePrefill } from '@/lib/data/wizard';
import type { SessionUser } from '@/lib/auth/session';

const mem = memoryDb();
let wren: SessionUser;
let tamsin: SessionUser;

const body = {
  species: 'pinus-sylvestris',
  branching: 'tertiary',
  date: '2027-05-10',
  shoot: 'candle-extending',
  position: 'beyond-silhouette',
  health: 'average',
} as const;

beforeAll(async () => {
  wren = await mem.user('member@candlewise.test');
  tamsin = await mem.user('member2@candlewise.test');
});

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
      id: shared.id,
      action: 'pinch',
      speciesSlug: 'pinus-sylvestris',
      speciesName: 'Scots pine',
      observedOn: '2027-05-10',
      askerName: 'Wren Alder',
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
    await mem.db.insert(trees).values({
      id: 'tree-w1',
      ownerId: wren.id,
      name: 'Riverside Scots',
      speciesSlug: 'pinus-sylvestris',
      containerShape: 'oval',
      containerLengthCm: 40,
      containerWidthCm: 30,
      collectedFromWild: true,
      collectedOn: '2026-04-01',
    });
    expect(await getTreePrefill('tree-w1', tamsin)).toBeNull();
    expect(await getTreePrefill('tree-w1', wren, '2027-05-10')).toMatchObject({
      speciesSlug: 'pinus-sylvestris',
      container: { shape: 'oval', lengthCm: 40, widthCm: 30 },
      recentlyCollected: true,
    });
    expect((await getTreePrefill('tree-w1', wren, '2029-05-10'))!.recentlyCollected).toBe(false);
    await expect(saveAnswer(tamsin, { ...body, treeId: 'tree-w1' })).rejects.toMatchObject({ status: 400 });
    const a = await saveAnswer(wren, { ...body, treeId: 'tree-w1' });
    expect((await getAnswer(a.id, wren))!.treeId).toBe('tree-w1');
    const list = await listOwnAnswers(wren, { limit: 100 });
    expect(list.items[0].id).toBe(a.id);
    expect((await listOwnAnswers(tamsin, {})).items).toEqual([]);
  });
});

describe('saving with an idempotency key', () => {
  it('writes one answer for one key and returns it again for a repeat', async () => {
    const before = (await listOwnAnswers(wren, { limit: 100 })).items.length;
    const key = 'phone-key-0000000001';
    const first = await saveAnswerOnce(wren, { ...body, note: 'first try' }, { idempotencyKey: key });
    const again = await saveAnswerOnce(wren, { ...body, note: 'first try' }, { idempotencyKey: key });
    expect(first.created).toBe(true);
    expect(again.created).toBe(false);
    expect(again.answer.id).toBe(first.answer.id);
    expect(again.answer.action).toBe(first.answer.action);
    expect((await listOwnAnswers(wren, { limit: 100 })).items.length).toBe(before + 1);
  });

  it('keeps keys per member: the same key from another member is a new answer', async () => {
    const key = 'phone-key-0000000002';
    const a = await saveAnswerOnce(wren, { ...body }, { idempotencyKey: key });
    const b = await saveAnswerOnce(tamsin, { ...body }, { idempotencyKey: key });
    expect(b.created).toBe(true);
    expect(b.answer.id).not.toBe(a.answer.id);
    expect(await getAnswer(a.answer.id, tamsin)).toBeNull();
  });

  it('lets only one of two racing copies in', async () => {
    const key = 'phone-key-0000000003';
    const [x, y] = await Promise.all([saveAnswerOnce(wren, { ...body }, { idempotencyKey: key }), saveAnswerOnce(wren, { ...body }, { idempotencyKey: key })]);
    expect(x.answer.id).toBe(y.answer.id);
    expect([x.created, y.created].sort()).toEqual([false, true]);
  });

  it('keeps the phone result only when it differs from the server', async () => {
    const server = await saveAnswer(wren, { ...body });
    const same = {
      action: server.action,
      headline: server.headline,
      engineVersion: server.engineVersion,
      speciesRevision: server.speciesRevision,
      reasons: server.reasons.map((r) => ({ ...r })),
    };
    const agreed = await saveAnswer(wren, { ...body, phoneResult: same });
    expect((await getAnswer(agreed.id, wren))!.phoneResult).toBeNull();
    const older = { ...same, action: 'wait' as const, speciesRevision: server.speciesRevision - 1 };
    const differed = await saveAnswer(wren, { ...body, phoneResult: older });
    expect((await getAnswer(differed.id, wren))!.phoneResult).toMatchObject({ action: 'wait', speciesRevision: server.speciesRevision - 1 });
    expect(phoneDiffers(older, server)).toBe(true);
    expect(phoneDiffers(same, server)).toBe(false);
  });
});
