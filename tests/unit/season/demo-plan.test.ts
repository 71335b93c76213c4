import { beforeAll, describe, expect, it } from 'vitest';
import { memoryDb } from '../../support/memory-db';
import { listTrees } from '@/lib/data/trees';
import { getTreePlan, thisWeek } from '@/lib/data/plan';
import type { SessionUser } from '@/lib/auth/session';

// The demo club, seeded for real: the demo member's Scots pine has its candle work in May
// (club at 45.5°N, latitude model), and "This week" in mid-May lists it.
const mem = memoryDb();
let member: SessionUser;

beforeAll(async () => {
  member = await mem.user('member@candlewise.test');
});

describe('the demo member’s season', () => {
  it('the refinement Scots pine has candle work in May; the recovering collected mugo has none', async () => {
    const trees = await listTrees(member);
    const scots = trees.find((t) => t.speciesSlug === 'pinus-sylvestris')!;
    const mugo = trees.find((t) => t.speciesSlug === 'pinus-mugo')!;
    const plan = (await getTreePlan(member, scots.id, '2027-05-15'))!;
    const candle = plan.windows.find((w) => w.task === 'candle-work')!;
    expect(candle.from <= '2027-05-31' && candle.to >= '2027-05-01').toBe(true);
    const mugoPlan = (await getTreePlan(member, mugo.id, '2027-05-15'))!;
    expect(mugoPlan.windows.map((w) => w.task)).not.toContain('candle-work');
    const week = await thisWeek(member, '2027-05-15');
    expect(week.some((i) => i.treeId === scots.id && i.window.task === 'candle-work')).toBe(true);
  });
});
