import { describe, expect, it } from 'vitest';
import { memoryDb } from '../support/memory-db';
import { invalidateReads } from '@/lib/data/read-cache';
import { eq } from 'drizzle-orm';
import { clubSettings } from '@/db/schema';
import { dueNow } from '@/lib/wizard/due-now';
import { getWizardSpecies } from '@/lib/data/species';
import { dueNowForTree, dueNowHeadlines, stageFor } from '@/lib/data/tree-due-now';
import { askParamsFor, isRecentlyCollected } from '@/lib/trees/describe';
import type { TreeDto } from '@/lib/data/trees';

const mem = memoryDb();

const tree = (over: Partial<TreeDto> = {}): TreeDto => ({
  id: 'tree-aaaaaaaaaaaa',
  name: 'Test Scots',
  speciesSlug: 'pinus-sylvestris',
  speciesName: 'Scots pine (Pinus sylvestris)',
  stageNotes: '',
  containerShape: 'rectangle',
  containerLengthCm: 40,
  containerWidthCm: 30,
  acquiredOn: null,
  collectedFromWild: false,
  collectedOn: null,
  notes: '',
  createdAt: '2026-01-01T00:00:00.000Z',
  updatedAt: '2026-01-01T00:00:00.000Z',
  ...over,
});

async function setHemisphere(h: 'north' | 'south') {
  await mem.db.update(clubSettings).set({ hemisphere: h }).where(eq(clubSettings.id, 1));
  // This writes past the data layer, so it tells the read cache itself.
  invalidateReads('settings');
}

describe('recent collection', () => {
  it('counts two years from the collection date, and an undated collection as recent', () => {
    expect(isRecentlyCollected({ collectedFromWild: true, collectedOn: '2025-06-01' }, '2027-05-31')).toBe(true);
    expect(isRecentlyCollected({ collectedFromWild: true, collectedOn: '2025-06-01' }, '2027-06-02')).toBe(false);
    expect(isRecentlyCollected({ collectedFromWild: true, collectedOn: null }, '2027-06-02')).toBe(true);
    expect(isRecentlyCollected({ collectedFromWild: false, collectedOn: null }, '2027-06-02')).toBe(false);
  });

  it('puts the stage the wizard would use, and the history, in the ask link', () => {
    const p = askParamsFor(
      tree({ collectedFromWild: true, collectedOn: '2026-09-01', containerShape: 'round', containerLengthCm: 28, containerWidthCm: null }),
      '2027-04-20',
    );
    expect(Object.fromEntries(p)).toEqual({
      tree: 'tree-aaaaaaaaaaaa',
      species: 'pinus-sylvestris',
      shape: 'round',
      lengthCm: '28',
      collected: '1',
      collectedOn: '2026-09-01',
    });
  });
});

describe('due now for a tree', () => {
  it('chooses recovery for a fresh collection, else the latest answer stage, else the engine default', () => {
    expect(stageFor(tree({ collectedFromWild: true, collectedOn: '2027-01-10' }), 'refinement', '2027-04-20').stage).toBe('recovery');
    expect(stageFor(tree(), 'development', '2027-04-20').stage).toBe('development');
    expect(stageFor(tree(), 'not-a-stage', '2027-04-20').stage).toBeUndefined();
    expect(stageFor(tree(), null, '2027-04-20').stage).toBeUndefined();
  });

  it('is exactly the wizard engine’s due-now for the club hemisphere (no second copy of the rules)', async () => {
    await setHemisphere('north');
    const species = (await getWizardSpecies('pinus-sylvestris'))!;
    for (const [date, stage] of [
      ['2027-04-20', null],
      ['2027-08-10', 'development'],
      ['2027-01-15', 'refinement'],
    ] as const) {
      const got = await dueNowForTree(tree(), stage, date);
      expect(got).toMatchObject(dueNow({ species, date, hemisphere: 'north', stage: stage ?? undefined }));
      expect(got?.hemisphere).toBe('north');
    }
  });

  it('says what to look for this month, never an action: spring lists candle states with conditional answers', async () => {
    await setHemisphere('north');
    const spring = (await dueNowForTree(tree(), null, '2027-04-20'))!;
    // common practice, no published source: in mid-spring pine candles extend, then their needles open
    expect(spring.lookFor.map((l) => l.shoot)).toEqual(['candle-extending', 'needles-opening']);
    expect(spring.headline).toBe('Look for: candle extending or needles opening');
    expect(spring.headline).not.toMatch(/shorten|pinch|prune|cut/i);
    expect(spring.lookFor[0].ifSeen).toMatch(/Shorten this candle/);
    const winter = (await dueNowForTree(tree(), null, '2027-01-15'))!;
    expect(winter.season).toBe('winter');
    expect(winter.lookFor.map((l) => l.shoot)).toEqual(['dormant-bud']);
  });

  it('defect 11: a development tree in June is not told to prune: nobody has seen back buds', async () => {
    await setHemisphere('north');
    const d = (await dueNowForTree(tree(), 'development', '2027-06-15'))!;
    expect(d.headline).toMatch(/^Look for:/);
    for (const l of d.lookFor) expect(l.ifSeen).not.toMatch(/^Cut this shoot back/);
  });

  it('follows the club’s hemisphere: July is winter in the south', async () => {
    await setHemisphere('south');
    const d = (await dueNowForTree(tree(), null, '2027-07-15'))!;
    // common practice, no published source: the southern calendar is shifted six months
    expect(d.season).toBe('winter');
    expect(d.feedingWindow).toMatch(/spring/i);
    expect(d.hemisphere).toBe('south');
    await setHemisphere('north');
    expect((await dueNowForTree(tree(), null, '2027-07-15'))!.season).toBe('summer');
  });

  it('a recently collected tree is let grow; an unknown species gives no advice', async () => {
    await setHemisphere('north');
    const d = (await dueNowForTree(tree({ collectedFromWild: true, collectedOn: '2027-02-01' }), null, '2027-04-20'))!;
    // common practice, no published source: collected trees recover before any pinching
    expect(d.stage).toBe('recovery');
    expect(d.lookFor.every((l) => l.ifSeen === 'Let it grow')).toBe(true);
    expect(await dueNowForTree(tree({ speciesSlug: 'pinus-imaginaria' }), null, '2027-04-20')).toBeNull();
    const heads = await dueNowHeadlines([tree(), tree({ id: 'tree-bbbbbbbbbbbb', speciesSlug: 'pinus-imaginaria' })], '2027-01-15');
    expect(heads).toEqual({ 'tree-aaaaaaaaaaaa': 'Look for: dormant bud' });
  });
});
