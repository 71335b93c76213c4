import { containerSchema, evaluateBodySchema, isRecovering, type EvaluateBody } from '@/lib/validation/wizard';
import { slugSchema } from '@/lib/validation/species';
import {
  branchingLevels,
  healthLevels,
  positions,
  shootStates,
  type Branching,
  type CandleStrength,
  type ContainerInput,
  type Health,
  type Hemisphere,
  type Position,
  type ShootState,
} from './types';

// The /ask questions, their order and when each one is asked. Pure; the machine and the page share it.
// Health and "collected recently" come first after the tree: for a recovering tree they decide the
// answer, and the shape questions after them are skipped.

export const askSteps = ['tree', 'species', 'health', 'shoot', 'branching', 'position', 'when', 'answer'] as const;
export type AskStep = (typeof askSteps)[number];
export type QuestionStep = Exclude<AskStep, 'answer'>;

/** The answer to "which of your trees": a tree id, or "not one of mine". */
export const NOT_MINE = 'none';

export interface AskAnswers {
  /** A tree id of the member's, or NOT_MINE. Only asked of a member who has trees. */
  tree?: string;
  /** The picked tree's species when the wizard knows it; the species question is then skipped. */
  treeSpecies?: string;
  species?: string;
  branching?: Branching;
  shoot?: ShootState;
  position?: Position;
  health?: Health;
  recentlyCollected?: boolean;
  backBuds?: boolean;
  /** Optional: a tree repotted this year is never decandled. */
  repottedThisYear?: boolean;
  /** Optional: this candle against the others on the tree (the engine assumes average). */
  candleStrength?: CandleStrength;
  date?: string;
  hemisphere?: Hemisphere;
  latitude?: number;
  container?: ContainerInput;
}

/** One of the member's trees, as the first question offers it. */
export interface TreeOption {
  id: string;
  name: string;
  /** The species as the wizard knows it; absent when it has no published species of that name. */
  speciesSlug?: string;
  speciesName: string;
  container?: ContainerInput;
  recentlyCollected: boolean;
}

/** What the flow knows beyond the answers: whether the member has trees to pick from. */
export interface Flow {
  hasTrees?: boolean;
}

export { isRecovering };

/** A question the answers so far make irrelevant is skipped. */
export function isRelevant(step: AskStep, a: AskAnswers, f: Flow = {}): boolean {
  switch (step) {
    case 'tree':
      return !!f.hasTrees;
    case 'species':
      return !(a.tree && a.tree !== NOT_MINE && a.treeSpecies);
    case 'branching':
      return !isRecovering(a);
    case 'position':
      return !isRecovering(a) && (a.branching === undefined || a.branching === 'tertiary');
    default:
      return true;
  }
}

/** The back-bud question only matters for a development branch whose needles have hardened. */
export function asksBackBuds(a: AskAnswers): boolean {
  return !isRecovering(a) && a.branching !== undefined && a.branching !== 'tertiary' && a.shoot === 'needles-hardened';
}

/** The candle-strength question only matters for a refinement shoot that has started growing. */
export function asksCandleStrength(a: AskAnswers): boolean {
  return !isRecovering(a) && a.branching === 'tertiary' && a.shoot !== undefined && a.shoot !== 'dormant-bud';
}

const oneOf = <T extends string>(list: readonly T[], v: unknown): v is T => typeof v === 'string' && (list as readonly string[]).includes(v);

/** Why the pot cannot be used yet, in the words of the field to fill; null when it can (or there is none). */
function containerProblem(c: ContainerInput | undefined): string | null {
  if (!c) return null;
  if (typeof c.lengthCm !== 'number' || !Number.isFinite(c.lengthCm)) return c.shape === 'round' ? 'Give the pot’s diameter' : 'Give the pot’s length';
  if (c.shape !== 'round' && (typeof c.widthCm !== 'number' || !Number.isFinite(c.widthCm))) return 'Give the pot’s width';
  const r = containerSchema.safeParse(c);
  return r.success ? null : r.error.issues[0].message;
}

/** Why Next is disabled on this step, or null when it is not. The last step is checked with the server's own schema. */
export function disabledReason(step: AskStep, a: AskAnswers): string | null {
  switch (step) {
    case 'tree':
      return a.tree ? null : 'Pick one of your trees, or “Not one of mine”';
    case 'species':
      return slugSchema.safeParse(a.species).success ? null : 'Choose the species from the list';
    case 'health':
      return oneOf(healthLevels, a.health) ? null : 'Say how the tree is doing';
    case 'shoot':
      return oneOf(shootStates, a.shoot) ? null : 'Pick what the shoot looks like';
    case 'branching':
      return oneOf(branchingLevels, a.branching) ? null : 'Pick how far the branching goes';
    case 'position':
      return oneOf(positions, a.position) ? null : 'Pick where the shoot is against the outline';
    case 'when': {
      if (!a.date) return 'Pick a date';
      const pot = containerProblem(a.container);
      if (pot) return pot;
      const r = evaluateBodySchema.safeParse(toEvaluateBody(a));
      return r.success ? null : r.error.issues[0].message;
    }
    case 'answer':
      return 'Answer every question first';
  }
}

export function isAnswered(step: AskStep, a: AskAnswers): boolean {
  return step !== 'answer' && disabledReason(step, a) === null;
}

export function nextStep(step: AskStep, a: AskAnswers, f: Flow = {}): AskStep {
  let i = askSteps.indexOf(step) + 1;
  while (i < askSteps.length - 1 && !isRelevant(askSteps[i], a, f)) i++;
  return askSteps[Math.min(i, askSteps.length - 1)];
}

/** The step before, or the same step when it is the first one asked. */
export function prevStep(step: AskStep, a: AskAnswers, f: Flow = {}): AskStep {
  let i = askSteps.indexOf(step) - 1;
  while (i >= 0 && !isRelevant(askSteps[i], a, f)) i--;
  return i < 0 ? step : askSteps[i];
}

export function firstStep(a: AskAnswers, f: Flow = {}): AskStep {
  return askSteps.find((s) => isRelevant(s, a, f)) ?? 'when';
}

/** The first relevant question not yet answered, or 'answer' when all are. */
export function firstOpenStep(a: AskAnswers, f: Flow = {}): AskStep {
  return askSteps.find((s) => s !== 'answer' && isRelevant(s, a, f) && !isAnswered(s, a)) ?? 'answer';
}

/** A step can be opened (from the URL or the back button) once every relevant step before it is answered. */
export function canReach(step: AskStep, a: AskAnswers, f: Flow = {}): boolean {
  const i = askSteps.indexOf(step);
  return askSteps.slice(0, i).every((s) => !isRelevant(s, a, f) || isAnswered(s, a));
}

/** The visible questions, for "Question 2 of 5". */
export function questionList(a: AskAnswers, f: Flow = {}): QuestionStep[] {
  return askSteps.filter((s): s is QuestionStep => s !== 'answer' && isRelevant(s, a, f));
}

/** The evaluate body for the answers; skipped and irrelevant answers are left out. */
export function toEvaluateBody(a: AskAnswers): EvaluateBody {
  const body: EvaluateBody = { species: a.species!, date: a.date!, shoot: a.shoot!, health: a.health! };
  if (!isRecovering(a)) {
    body.branching = a.branching;
    if (a.branching === 'tertiary') body.position = a.position;
    if (asksCandleStrength(a) && a.candleStrength) body.candleStrength = a.candleStrength;
    if (asksBackBuds(a) && typeof a.backBuds === 'boolean') body.backBuds = a.backBuds;
  }
  if (a.hemisphere) body.hemisphere = a.hemisphere;
  if (typeof a.latitude === 'number') body.latitude = a.latitude;
  if (a.recentlyCollected) body.recentlyCollected = true;
  if (a.repottedThisYear) body.repottedThisYear = true;
  if (a.container) body.container = a.container;
  return body;
}

/**
 * A run carried on (after a reload or sign-in) that never answered the tree question was begun
 * without trees to pick from: it is about "not one of mine", so it does not open at the tree question.
 */
export function resumedAnswers(a: AskAnswers, f: Flow = {}): AskAnswers {
  return f.hasTrees && a.species && !a.tree ? { ...a, tree: NOT_MINE } : a;
}

/** The answers after picking a tree (or "not one of mine"): the tree's species, pot and collection replace the last tree's. */
export function answersForTree(a: AskAnswers, tree: TreeOption | null): AskAnswers {
  const { treeSpecies: _s, container: _c, recentlyCollected: _r, ...rest } = a;
  const previous = a.tree && a.tree !== NOT_MINE;
  if (previous && a.species === a.treeSpecies) delete rest.species;
  if (!tree) return { ...rest, tree: NOT_MINE, ...(previous ? {} : { container: a.container, recentlyCollected: a.recentlyCollected }) };
  return {
    ...rest,
    tree: tree.id,
    ...(tree.speciesSlug ? { species: tree.speciesSlug, treeSpecies: tree.speciesSlug } : {}),
    ...(tree.container ? { container: tree.container } : {}),
    ...(tree.recentlyCollected ? { recentlyCollected: true } : {}),
  };
}
