import 'server-only';
import { and, desc, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { answers } from '@/db/schema';
import { getTree, listTrees, type TreeDto } from '@/lib/data/trees';
import { getWizardSpecies } from '@/lib/data/species';
import { getClubSettings } from '@/lib/data/settings';
import { stageFor } from '@/lib/data/tree-due-now';
import { observationsOf, planRecordFor } from '@/lib/data/season';
import { isRecentlyCollected } from '@/lib/trees/describe';
import { dueSoon, planForTree, type PlanTree, type PlanWindow, type TreePlan } from '@/lib/season/plan';
import type { SessionUser } from '@/lib/auth/session';
import type { Health, WizardInput } from '@/lib/wizard/types';
import { healthLevels } from '@/lib/wizard/types';
import { todayIso } from '@/lib/validation/trees';

// A member's plan for one tree, and "This week" over all their trees. Owner-scoped through
// getTree / listTrees: somebody else's tree id is a 404.

async function latestAnswerOf(ownerId: string, treeId: string) {
  const db = await getDb();
  const [row] = await db
    .select({ stage: answers.stage, input: answers.input })
    .from(answers)
    .where(and(eq(answers.treeId, treeId), eq(answers.userId, ownerId)))
    .orderBy(desc(answers.observedOn), desc(answers.createdAt))
    .limit(1);
  return row ?? null;
}

async function planTreeFacts(tree: TreeDto, ownerId: string, today: string): Promise<PlanTree> {
  const latest = await latestAnswerOf(ownerId, tree.id);
  const { stage } = stageFor(tree, latest?.stage ?? null, today);
  const input = (latest?.input ?? {}) as Partial<WizardInput>;
  const resolved = stage ?? 'refinement';
  const health: Health = healthLevels.includes(input.health as Health) ? (input.health as Health) : resolved === 'recovery' ? 'weak' : 'strong';
  return {
    stage: resolved,
    health,
    recentlyCollected: isRecentlyCollected(tree, today),
    backBuds: typeof input.backBuds === 'boolean' ? input.backBuds : undefined,
    repottedThisYear: typeof input.repottedThisYear === 'boolean' && (input.date ?? '').slice(0, 4) === today.slice(0, 4) ? input.repottedThisYear : undefined,
    container:
      tree.containerShape && tree.containerLengthCm
        ? { shape: tree.containerShape, lengthCm: tree.containerLengthCm, ...(tree.containerWidthCm ? { widthCm: tree.containerWidthCm } : {}) }
        : undefined,
  };
}

export interface TreePlanDto extends TreePlan {
  treeId: string;
  today: string;
}

async function planFor(actor: SessionUser, tree: TreeDto, today: string): Promise<TreePlanDto | null> {
  const [species, settings] = await Promise.all([getWizardSpecies(tree.speciesSlug), getClubSettings()]);
  if (!species) return null;
  const [facts, record, observations] = await Promise.all([
    planTreeFacts(tree, actor.id, today),
    planRecordFor(actor, today, settings.hemisphere),
    observationsOf(actor.id, tree.id),
  ]);
  const plan = memoPlan({ species, tree: facts, today, hemisphere: settings.hemisphere, latitude: settings.defaultLatitude, record, observations });
  return { ...plan, treeId: tree.id, today };
}

// A plan asks the engine about every day of the season (planForTree), which is most of a plan
// request's time, while its inputs change seldom: the same plan is worked out again and again on
// every visit, on "This week" and for the reminders. planForTree is a pure function of its input,
// so its result is kept by that input. The species and the record are large; they come from the
// read cache (read-cache.ts), where one object stands for one published revision or one state of
// a record until a write drops it, so they enter the key as the identity of that object; the rest
// enters as its value. Any change (a new revision, an import, an observation, a saved answer, a
// tree edit, another day) is a different key, so nothing here needs invalidating; old keys age
// out of the bounded map. Each process keeps its own; nothing in it can be stale.
const PLAN_MEMO_SIZE = 500;
const planMemo = new Map<string, TreePlan>();
const objectIds = new WeakMap<object, number>();
let nextObjectId = 1;
const identity = (o: object | null | undefined) => {
  if (!o) return 0;
  let id = objectIds.get(o);
  if (id === undefined) objectIds.set(o, (id = nextObjectId++));
  return id;
};

function memoPlan(input: Parameters<typeof planForTree>[0]): TreePlan {
  const { species, record, ...rest } = input;
  const key = JSON.stringify([identity(species), identity(record), rest]);
  const hit = planMemo.get(key);
  if (hit) {
    // Most recently used last, so the oldest is the first to go.
    planMemo.delete(key);
    planMemo.set(key, hit);
    return hit;
  }
  const plan = planForTree(input);
  planMemo.set(key, plan);
  if (planMemo.size > PLAN_MEMO_SIZE) planMemo.delete(planMemo.keys().next().value!);
  return plan;
}

/** The plan of the actor's own tree; 404 for anybody else's. Null when its species is unpublished. */
export async function getTreePlan(actor: SessionUser, treeId: string, today = todayIso()): Promise<TreePlanDto | null> {
  const tree = await getTree(actor, treeId);
  return planFor(actor, tree, today);
}

export interface WeekItem {
  treeId: string;
  treeName: string;
  speciesSlug: string;
  window: PlanWindow;
}

/**
 * Every tree's tasks open now or due within `days` days (14 on the member's home; the weekly
 * reminder asks for the 7 days of its week).
 */
export async function thisWeek(actor: SessionUser, today = todayIso(), days = 14): Promise<WeekItem[]> {
  const trees = await listTrees(actor);
  const items: WeekItem[] = [];
  for (const tree of trees.slice(0, 100)) {
    const plan = await planFor(actor, tree, today);
    if (!plan) continue;
    for (const w of dueSoon(plan, today, days)) items.push({ treeId: tree.id, treeName: tree.name, speciesSlug: tree.speciesSlug, window: w });
  }
  return items.sort((a, b) => (a.window.from < b.window.from ? -1 : a.window.from > b.window.from ? 1 : a.treeName.localeCompare(b.treeName)));
}
