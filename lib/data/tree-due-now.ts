import 'server-only';
import { dueNow, type DueNow } from '@/lib/wizard/due-now';
import { stages, type Stage } from '@/lib/wizard/types';
import { getWizardSpecies } from '@/lib/data/species';
import { getClubSettings } from '@/lib/data/settings';
import { todayIso } from '@/lib/validation/trees';
import type { TreeDto } from '@/lib/data/trees';
import { isRecentlyCollected } from '@/lib/trees/describe';

// "Due now" for a member's trees: the wizard's own due-now engine, fed with the club's
// hemisphere, the tree's species and the best stage we know for the tree.

export interface TreeDueNow extends DueNow {
  hemisphere: 'north' | 'south';
  /** Why this stage was assumed, in plain words. */
  stageBasis: string;
}

export function stageFor(
  t: Pick<TreeDto, 'collectedFromWild' | 'collectedOn'>,
  latestAnswerStage: string | null,
  today: string,
): { stage: Stage | undefined; basis: string } {
  if (isRecentlyCollected(t, today)) return { stage: 'recovery', basis: 'collected from the wild within the last two years' };
  if (latestAnswerStage && (stages as readonly string[]).includes(latestAnswerStage)) {
    return { stage: latestAnswerStage as Stage, basis: 'the stage of your latest answer about this tree' };
  }
  return { stage: undefined, basis: 'no answer about this tree yet, so refinement is assumed' };
}

export async function dueNowForTree(tree: TreeDto, latestAnswerStage: string | null, today = todayIso()): Promise<TreeDueNow | null> {
  const [species, settings] = await Promise.all([getWizardSpecies(tree.speciesSlug), getClubSettings()]);
  if (!species) return null;
  const { stage, basis } = stageFor(tree, latestAnswerStage, today);
  return { ...dueNow({ species, stage, date: today, hemisphere: settings.hemisphere }), hemisphere: settings.hemisphere, stageBasis: basis };
}

/** The headline due now for each tree of a list (one species lookup per species). */
export async function dueNowHeadlines(trees: TreeDto[], today = todayIso()): Promise<Record<string, string>> {
  const settings = await getClubSettings();
  const bySlug = new Map<string, Awaited<ReturnType<typeof getWizardSpecies>>>();
  const out: Record<string, string> = {};
  for (const t of trees) {
    if (!bySlug.has(t.speciesSlug)) bySlug.set(t.speciesSlug, await getWizardSpecies(t.speciesSlug));
    const species = bySlug.get(t.speciesSlug);
    if (!species) continue;
    const { stage } = stageFor(t, null, today);
    out[t.id] = dueNow({ species, stage, date: today, hemisphere: settings.hemisphere }).headline;
  }
  return out;
}
