import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { openDatabase, type DbHandle } from '@/db/open';
import { setDbHandle } from '@/db/client';
import { seed } from '@/db/seed';
import { users } from '@/db/schema';
import { listTrees } from '@/lib/data/trees';
import { getTreePlan, thisWeek } from '@/lib/data/plan';
import type { SessionUser } from '@/lib/auth/session';

// The demo club, seeded for real: the demo member's Scots pine has its candle work in May
// (club at 45.5°N, latitude model), and "This week" in mid-May lists it.
let handle: DbHandle;
let member: SessionUser;

beforeAll(async () => {
  handle = await openDatabase({ pgliteDir: 'memory' });
  setDbHandle(handle);
  await seed(handle.db);
  const [u] = await handle.db.select().from(users).where(eq(users.email, 'member@candlewise.test'));
  member = { id: u.id, name: u.name ?? '', email: u.email, role: u.role, tokenVersion: u.tokenVersion };
});
afterAll(() => handle?.close());

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
