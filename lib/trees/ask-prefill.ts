import { containerSchema } from '@/lib/validation/wizard';
import { containerShapes, type ContainerShape } from '@/lib/validation/trees';
import type { AskAnswers, TreeOption } from '@/lib/wizard/ask-steps';
import type { ContainerInput } from '@/lib/wizard/types';
import { isRecentlyCollected } from './describe';

// What /ask fills in from a link or from one of the member's trees, checked with the wizard's own
// schemas so that nothing filled in here can be refused when the answer is worked out.

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
const num = (v: string | undefined) => (v === undefined || v.trim() === '' ? undefined : Number(v));

/** A pot the wizard accepts, or nothing. */
function wizardContainer(shape: unknown, lengthCm: number | null | undefined, widthCm: number | null | undefined): ContainerInput | undefined {
  if (typeof shape !== 'string' || !(containerShapes as readonly string[]).includes(shape)) return undefined;
  const c = { shape: shape as ContainerShape, lengthCm, ...(shape !== 'round' && widthCm != null ? { widthCm } : {}) };
  const r = containerSchema.safeParse(c);
  return r.success ? r.data : undefined;
}

/** Pre-fill from a link: ?species=&shape=&lengthCm=&widthCm=&collected=1 (no tree needed). */
export function prefillFromQuery(q: Search, known: Set<string>): AskAnswers {
  const out: AskAnswers = {};
  const species = one(q.species);
  if (species && known.has(species)) out.species = species;
  const container = wizardContainer(one(q.shape), num(one(q.lengthCm)), num(one(q.widthCm)));
  if (container) out.container = container;
  if (one(q.collected) === '1') out.recentlyCollected = true;
  return out;
}

/** A member's tree as the wizard's first question offers it. */
export function treeOption(
  t: {
    id: string;
    name: string;
    speciesSlug: string;
    speciesName: string | null;
    containerShape: ContainerShape | null;
    containerLengthCm: number | null;
    containerWidthCm: number | null;
    collectedFromWild: boolean;
    collectedOn: string | null;
  },
  known: Set<string>,
  today: string,
): TreeOption {
  const container = wizardContainer(t.containerShape, t.containerLengthCm, t.containerWidthCm);
  return {
    id: t.id,
    name: t.name,
    ...(known.has(t.speciesSlug) ? { speciesSlug: t.speciesSlug } : {}),
    speciesName: t.speciesName ?? t.speciesSlug,
    ...(container ? { container } : {}),
    recentlyCollected: isRecentlyCollected(t, today),
  };
}
