import type { Caution, Reason } from './types';

// The rule set. Every rule has a stable id (answers store them), a reason in plain words and the
// source it rests on. Bump ENGINE_VERSION whenever a rule's meaning or the decision logic changes,
// so a stored answer can be re-run and compared.

export const ENGINE_VERSION = '1.0.0';

export const COMMON = 'common practice';
export const OURS = 'Candlewise rule (our own)';

export interface RuleDef {
  id: string;
  source: string;
  text: string;
}

const defs = [
  // Stage
  { id: 'stage.refinement', text: 'Primary, secondary and tertiary branching are all in place, so this branch is in refinement: the aim now is to keep the shape and even out strength.', source: COMMON },
  { id: 'stage.development', text: 'The branching is not yet complete (no tertiary branches), so this branch is in development: the aim is to build strength and get back buds.', source: COMMON },
  { id: 'stage.recovery-collected', text: 'The tree was collected from the wild within the last two seasons. Let it grow and rebuild roots; collected trees usually begin to back-bud only after about two years in a container with generous feeding.', source: COMMON },
  { id: 'stage.recovery-weak', text: 'The tree is weak. Let it grow and rebuild roots before any pinching or pruning; every cut takes strength it does not have.', source: COMMON },

  // Refinement: pinching
  { id: 'refine.pinch-soft-candle', text: 'The candle is a soft, single elongating cylinder pushing out beyond the silhouette: pinch it now to keep the shape and move strength inward to the weaker interior shoots.', source: COMMON },
  { id: 'refine.pinch-auxin', text: 'Pinching removes the tip’s auxin, which was holding back the buds behind it; with feeding those buds elongate in turn.', source: COMMON },
  { id: 'refine.keep-two-pairs-single-flush', text: 'Never remove a candle completely on a single-flush pine: leave part of it, at least two pairs of needles’ worth, so the shoot keeps this year’s growth.', source: COMMON },
  { id: 'refine.keep-part-of-candle', text: 'Leave part of the candle, at least two pairs of needles’ worth, so the shoot keeps growth to carry it.', source: COMMON },
  { id: 'refine.successive-elongations', text: 'A vigorous single-flush pine can give up to three elongations in one spring. Pinch each one as it passes the silhouette.', source: COMMON },
  { id: 'refine.too-late-needles-open', text: 'The needles are already separating from the candle: it is too late to pinch. A pinch now can take the whole bud. Let this shoot harden off.', source: COMMON },
  { id: 'refine.hardened-nothing-to-pinch', text: 'This year’s needles have hardened: the pinching time for this shoot has passed.', source: COMMON },
  { id: 'refine.bud-not-yet', text: 'The bud has not started to extend yet; there is nothing to pinch until it becomes a candle.', source: COMMON },
  { id: 'refine.interior-let-grow', text: 'Interior or weak shoots are let grow, so that they gain strength.', source: COMMON },
  { id: 'refine.at-silhouette-nothing', text: 'The shoot is within the silhouette: it needs nothing now. Pinch only once it pushes out beyond the silhouette.', source: COMMON },

  // Flush habit
  { id: 'flush.single-never-decandle', text: 'A single-flush pine gives one flush a season: it is never decandled, because losing that flush loses the year.', source: COMMON },
  { id: 'flush.double-decandle', text: 'A strong, healthy double-flush pine in refinement can be decandled in early summer, once the spring candles have extended: this pushes a second, shorter flush.', source: COMMON },
  { id: 'flush.double-wait-for-early-summer', text: 'On a strong double-flush pine in refinement, let the spring candles extend; the time to decandle is early summer.', source: COMMON },
  { id: 'flush.double-decandle-window-passed', text: 'Early summer has passed: a second flush pushed now would not harden before the cold. Do not decandle this year.', source: COMMON },
  { id: 'flush.double-not-strong', text: 'Only a strong, healthy tree is decandled; this one is not strong enough, so it is treated by pinching instead.', source: COMMON },
  { id: 'flush.no-decandle-development', text: 'A tree in development is not decandled: it needs all its foliage to build strength.', source: COMMON },
  { id: 'flush.no-decandle-weak', text: 'A weak or recovering tree is never decandled.', source: COMMON },

  // Development
  { id: 'develop.let-extend', text: 'Let the candles extend and needle out. More foliage means more water and sugar moving through the branch, and that traffic is what sets back buds.', source: COMMON },
  { id: 'develop.no-early-prune', text: 'Pruning now would remove the very surface that would have produced back buds.', source: COMMON },
  { id: 'develop.prune-hardened-with-back-buds', text: 'Back buds are present and this year’s needles have hardened off: prune now. Remove the apical tip, leaving at least two pairs of needles below the cut, so the back buds can candle. Then the branch moves on toward refinement.', source: COMMON },
  { id: 'develop.wait-for-back-buds', text: 'The needles have hardened but there are no back buds yet: keep letting it grow; prune once back buds show.', source: COMMON },
  { id: 'develop.bud-not-yet', text: 'The bud has not started to extend: wait for the candle, then let it grow.', source: COMMON },

  // Recovery
  { id: 'recover.let-grow', text: 'Let every shoot grow freely this season; do not pinch, prune or decandle.', source: COMMON },

  // Season
  { id: 'season.winter-dormant', text: 'The tree is in winter dormancy: there is nothing to pinch or pruned growth to read now.', source: COMMON },
  { id: 'season.out-of-season', text: 'This shoot state is unusual for the season; the answer follows the shoot state you saw.', source: COMMON },
  { id: 'season.south-shift', text: 'In the southern hemisphere the calendar is shifted six months (October is mid-spring).', source: COMMON },

  // Scope
  { id: 'scope.not-a-pine', text: 'These rules are written for pines (candles, flushes, needle pairs). For this conifer, treat the answer as a rough guide only.', source: COMMON },

  // Feeding
  { id: 'feed.purpose-refinement', text: 'Purpose: give the candles strength to redistribute after pinching, without coarse growth. Feed consistently and moderately.', source: COMMON },
  { id: 'feed.purpose-development', text: 'Purpose: vigour. Heavy feeding builds the foliage that sets back buds.', source: COMMON },
  { id: 'feed.purpose-recovery', text: 'Purpose: rebuild roots and strength. Feed steadily with organic pellets so the soil life returns.', source: COMMON },
  { id: 'feed.refinement-pellets', text: 'Refinement: pelletised organic fertiliser from spring through autumn, about four piles of six to eight pellets for a mid-sized pot, spaced evenly around the pot and halfway between trunk and rim.', source: COMMON },
  { id: 'feed.development-pellets', text: 'Development: heavy feeding, ten to twelve pellets per pile and about twice as many piles as in refinement for the same pot, plus a foliar feed such as fish emulsion or kelp.', source: COMMON },
  { id: 'feed.not-heavy-in-refinement', text: 'The heavy feeding used in development would give coarse, unrefinable growth on a tree in refinement.', source: COMMON },
  { id: 'feed.hold-back-strong-needle-response', text: 'This species’ needles lengthen strongly with feeding: in refinement, hold back spring feeding and start once this year’s needles have hardened.', source: COMMON },
  { id: 'feed.why-organic', text: 'Why organic pellets: they release small amounts steadily, and organic matter feeds the soil life, above all the mycorrhizal fungi pines depend on to take up water and nutrients. Feeding only immediately available chemical nutrients lets that life die back, and a container tree then loses resistance to heat, cold, drought, pests and disease.', source: COMMON },
  { id: 'feed.pile-scaling', text: 'The number of piles scales with the soil surface of the pot, calibrated so that about 1 200 cm² (e.g. 40 × 30 cm) gets about four piles in refinement and about eight in development; pellets per pile stay the same. This scaling is our own rule.', source: OURS },
  { id: 'feed.mid-sized-pot', text: 'No pot size was given, so the plan is for a mid-sized pot (about 40 × 30 cm).', source: OURS },
  { id: 'feed.winter-none', text: 'No feeding in winter dormancy. Start again in spring.', source: COMMON },
] as const satisfies readonly RuleDef[];

export type RuleId = (typeof defs)[number]['id'];

export const RULES: Record<RuleId, RuleDef> = Object.fromEntries(defs.map((d) => [d.id, d])) as Record<RuleId, RuleDef>;

export function reason(id: RuleId, extra?: string): Reason {
  const r = RULES[id];
  return { rule: r.id, text: extra ? `${r.text} ${extra}` : r.text, source: r.source };
}

// Cautions are not decisions, but they are part of the versioned rule set too.
export const CAUTIONS = {
  organicFertiliser: { text: 'Organic fertiliser attracts dogs and some kinds are harmful if eaten: keep pets and children away from the pot, and wear gloves when handling it.', source: COMMON },
  fishEmulsion: { text: 'Fish emulsion attracts animals and can upset the stomach if swallowed: store it out of reach of children and pets, and wear gloves when mixing and spraying.', source: COMMON },
  wildCollecting: { text: 'Collecting from the wild needs the landowner’s permission and any permit local law requires.', source: COMMON },
  tools: { text: 'Use clean, sharp tools and cut away from your hands; disinfect blades between trees.', source: COMMON },
  labels: { text: 'Follow the directions on the fertiliser label and your local rules; where they differ from this plan, they come first.', source: COMMON },
  outOfSeason: (shoot: string, season: string) => ({ text: `A shoot that is “${shoot}” in ${season} is unusual. Check the observation (the date, the hemisphere, and which shoot you looked at) before acting.`, source: COMMON }),
} satisfies Record<string, Caution | ((...a: string[]) => Caution)>;
