import type { Caution, Reason } from './types';

// The rule set. Every rule has a stable id (answers store them), a reason in plain words and the
// source it rests on: a named publication where one exists, otherwise common practice of the
// trade, or our own stated rule. Bump ENGINE_VERSION whenever a rule's meaning or the decision
// logic changes, so a stored answer can be re-run and compared.

export const ENGINE_VERSION = '2.0.0';

const COMMON = 'common practice';
const OURS = 'Candlewise rule (our own)';

// Published sources, named as their publishers name them.
const SRC = {
  candleFraction:
    'University of Wisconsin Plant Disease Diagnostics Clinic, “How to properly prune evergreens” (2015): remove about half to two-thirds of each candle',
  candleSoft: 'Michigan State University Extension, “Pruning pines”: shorten candles while soft, before the needles open and harden',
  pineBareWood: 'Colorado State University Extension, CMG GardenNotes #617 “Pruning Evergreens”: pines do not regrow from wood without needles',
  pineWhorlBuds: 'Michigan State University Extension, “Pruning pines”: new buds form near the cut on a shortened candle',
  deadZone:
    'Wisconsin Horticulture, UW–Madison Division of Extension, “Pruning planner for evergreen shrubs” (2025): junipers and false cypress do not refill a bare interior',
  branchByBranch: 'The Morton Arboretum, “Pruning evergreens”: prune branch by branch following the branching, rather than shearing',
  spruceLateral:
    'University of Wisconsin Plant Disease Diagnostics Clinic, “How to properly prune evergreens” (2015): cut spruce, fir and Douglas fir back to a side bud',
  spruceNoAdventitious: 'University of Wisconsin–Extension, “Christmas Tree Shearing” (G3268): spruce and fir rely on buds already present',
  yewOldWood: 'NYBG Plant Information Service, “Can an overgrown yew bush be revived?” (2021): yew regrows from old wood',
  hemlockLatent:
    'University of Delaware Cooperative Extension, “Pruning Evergreens”, quoted by Ask Extension #872989 (2024): hemlock has latent buds further down the stem',
  transplantFeed: 'University of Maryland Extension, “After planting care”: newly planted trees gain nothing from fertiliser while they establish roots',
  transplantFeedNc: 'ECHO Development Notes no. 45 (1994), digest of NC State research: go easy with fertiliser after transplanting',
} as const;

export interface RuleDef {
  id: string;
  source: string;
  text: string;
}

const defs = [
  // Stage
  {
    id: 'stage.refinement',
    text: 'The branch has primary, secondary and tertiary branching, so it is in refinement: the work now is keeping the shape and evening out strength across the tree.',
    source: COMMON,
  },
  {
    id: 'stage.development',
    text: 'The branching is not complete yet (no tertiary branches), so the branch is in development: the work is building strength and getting new buds further back.',
    source: COMMON,
  },
  {
    id: 'stage.recovery-collected',
    text: 'The tree was dug up from the wild recently. It is in recovery: let it grow and make new roots. Collected trees usually need about two years in a container before shaping starts.',
    source: COMMON,
  },
  {
    id: 'stage.recovery-weak',
    text: 'The tree is weak. It is in recovery: let it grow and rebuild roots before any pinching or pruning, because every cut costs it strength it does not have.',
    source: COMMON,
  },

  // Pines in refinement: candles
  {
    id: 'pine.shorten-soft-candle',
    text: 'The candle is still soft and lengthening beyond the silhouette: shorten it now, before its needles open out. Shortened at this stage it sets new buds near the cut, and the strength it would have used goes to the weaker shoots.',
    source: `${SRC.candleSoft}; ${SRC.pineWhorlBuds}`,
  },
  {
    id: 'pine.candle-fraction',
    text: 'How much to take: on a strong candle remove about half to two-thirds of its length, on an average one less, and leave a weak one whole.',
    source: SRC.candleFraction,
  },
  {
    id: 'pine.never-whole-single',
    text: 'On a pine that grows one flush a season, never remove a whole candle: that shoot would have no growth this year and may not bud again.',
    source: COMMON,
  },
  {
    id: 'pine.five-needle-light',
    text: 'Five-needle pines grow slowly and bud back less readily: reduce their candles lightly, and leave weak shoots alone so they gain strength.',
    source: COMMON,
  },
  {
    id: 'pine.multinodal-whorl',
    text: 'This pine sets more than one whorl of buds along one year’s shoot: shorten to just above a whorl, so the buds there take over.',
    source: COMMON,
  },
  {
    id: 'pine.successive-elongations',
    text: 'On a vigorous, well-fed two-needle pine pinched early, the buds left behind the pinch can lengthen in turn, two or three times in one spring. This is not a second flush: it is the same spring’s growth continuing from buds below the pinch. Pinch each as it passes the silhouette.',
    source: COMMON,
  },
  {
    id: 'pine.too-late-needles-open',
    text: 'The needles are already spreading away from the candle, so it is too late to shorten it this spring: cutting now can remove the buds that would grow next year. Let this shoot harden.',
    source: SRC.candleSoft,
  },
  {
    id: 'pine.hardened-summer-wait',
    text: 'This year’s needles have hardened. Leave the shoot through summer; the time to shorten hardened shoots and select buds is late summer and autumn.',
    source: COMMON,
  },
  { id: 'pine.bud-not-yet', text: 'The bud has not started to lengthen: there is nothing to shorten until it becomes a candle.', source: COMMON },
  {
    id: 'pine.interior-let-grow',
    text: 'Interior and weak shoots are let grow so they gain strength; the outer, stronger shoots are the ones reduced.',
    source: COMMON,
  },
  {
    id: 'refine.at-silhouette-nothing',
    text: 'The shoot is inside the silhouette: it needs nothing now. Shorten it only if it pushes out beyond the outline.',
    source: COMMON,
  },
  { id: 'refine.weak-shoot-leave', text: 'This shoot is weak compared with the others on the tree: leave it whole so it gains strength.', source: COMMON },
  {
    id: 'pine.weak-candle-leave',
    text: 'This candle is weak compared with the others on the tree: leave it whole so it gains strength.',
    source: SRC.candleFraction,
  },
  { id: 'pine.no-bare-wood', text: 'Always leave needles below a cut: a pine does not grow new shoots from bare wood.', source: SRC.pineBareWood },

  // Pines: autumn work
  {
    id: 'pine.autumn-cut-back',
    text: 'Late summer to autumn, after the needles have hardened: cut shoots that reach beyond the silhouette back to a bud or to a few needle bundles, so next year’s growth starts closer in.',
    source: COMMON,
  },
  {
    id: 'pine.autumn-thin',
    text: 'Autumn: select buds (keep two at each tip, removing the strongest and the weakest of a cluster) and pull out old needles so light reaches the inner buds. Strong areas are thinned more than weak ones.',
    source: COMMON,
  },
  {
    id: 'pine.double-autumn-thin',
    text: 'After the second flush has hardened, reduce the new buds to two per tip, and pull old needles in the strong areas so the weaker areas catch up.',
    source: COMMON,
  },
  {
    id: 'pine.five-autumn-light',
    text: 'On a five-needle pine, autumn work is light: remove only crowded buds and the oldest needles; keep every weak shoot.',
    source: COMMON,
  },

  // Double-flush pines
  {
    id: 'flush.double-decandle',
    text: 'The spring candles have finished lengthening, the tree is strong and in refinement, and it was not repotted this year: cut this year’s candles off now. A second, shorter flush with shorter needles follows.',
    source: COMMON,
  },
  {
    id: 'flush.double-wait-candles-extending',
    text: 'The candles are still lengthening. Candles are cut only once they have finished (needles starting to open, or hardened); until then let them grow.',
    source: COMMON,
  },
  {
    id: 'flush.double-window-not-yet',
    text: 'It is too early in your season to cut the candles: the window opens later, so the second flush does not start too soon and grow long.',
    source: OURS,
  },
  {
    id: 'flush.double-window-passed',
    text: 'Your season’s window for cutting candles has passed: a second flush started now would not harden before the cold. Leave the candles this year.',
    source: OURS,
  },
  {
    id: 'flush.double-no-window',
    text: 'At this latitude the growing season is too short for a second flush to harden: Candlewise does not suggest cutting candles here. Shorten them as for a single-flush pine.',
    source: OURS,
  },
  { id: 'flush.double-tropics', text: 'Within the tropics the calendar seasons say little: the answer follows the shoot state alone.', source: OURS },
  {
    id: 'flush.double-degree-days-low',
    text: 'The heat sum so far this season is below what spring shoot growth usually needs: the candles have probably not finished; wait.',
    source: OURS,
  },
  {
    id: 'flush.double-average-strongest-only',
    text: 'The tree is of average strength: do not cut every candle. Either skip it this year, or cut only the candles in the strongest areas and leave the rest.',
    source: COMMON,
  },
  { id: 'flush.double-average-leave', text: 'The tree is of average strength and this candle is not among the strongest: leave it this year.', source: COMMON },
  {
    id: 'flush.no-decandle-repotted',
    text: 'The tree was repotted this year: its candles are not cut. Repotting and candle cutting in one year take too much strength.',
    source: COMMON,
  },
  { id: 'flush.no-decandle-development', text: 'A tree in development keeps its candles: it needs all its foliage to build strength.', source: COMMON },
  { id: 'flush.no-decandle-weak', text: 'A weak or recovering tree never has its candles cut.', source: COMMON },
  {
    id: 'flush.single-never-decandle',
    text: 'This pine pushes one flush a season: its candles are never cut off whole, because it would not replace them this year.',
    source: COMMON,
  },

  // Development (all groups)
  {
    id: 'develop.let-extend',
    text: 'Let the new shoots lengthen and the needles grow out. More foliage makes more sugars for the branch, which is what builds strength and new buds further back.',
    source: COMMON,
  },
  { id: 'develop.no-early-prune', text: 'Cutting the new growth now would remove the foliage that feeds new buds on the older wood.', source: COMMON },
  {
    id: 'develop.prune-hardened-with-back-buds',
    text: 'Back buds are showing and this year’s growth has hardened: cut the long shoot back to just beyond the back buds, so they grow next spring and the branch becomes shorter and denser.',
    source: COMMON,
  },
  {
    id: 'develop.wait-for-back-buds',
    text: 'This year’s growth has hardened but there are no back buds yet: keep letting the shoot grow; cut back once back buds show.',
    source: COMMON,
  },
  { id: 'develop.bud-not-yet', text: 'The bud has not started to grow: wait for it, then let it grow.', source: COMMON },

  // Recovery
  { id: 'recover.let-grow', text: 'Let every shoot grow freely this season: no pinching, pruning or cutting back.', source: COMMON },

  // Junipers, cypresses, Cryptomeria, swamp cypress
  {
    id: 'scale.trim-to-fork',
    text: 'Trim long new shoots with sharp scissors, cutting each back to a fork or side shoot that has green foliage beyond it. Do not shear across the foliage and do not pull tips off with your fingers: both leave brown ends.',
    source: `${SRC.branchByBranch}; finger-pinching: ${COMMON}`,
  },
  {
    id: 'scale.keep-green',
    text: 'Keep green growth at the end of every branch: cut into the bare inner part of the branch and it usually will not grow again.',
    source: SRC.deadZone,
  },
  {
    id: 'scale.not-while-hardening',
    text: 'Trim while the new growth is active in late spring or in early summer; after that, let it be until next season.',
    source: COMMON,
  },
  { id: 'scale.interior-let-grow', text: 'Inner shoots are left to grow; they are what keeps foliage close to the trunk.', source: COMMON },

  // Spruce, Douglas fir, hemlock
  {
    id: 'spruce.shorten-extending',
    text: 'While the new shoot is still soft and lengthening, shorten it by pinching or cutting off part of it (about half on strong shoots), leaving a side bud or the base of the new growth with its needles.',
    source: `${SRC.spruceLateral}; fraction: ${COMMON}`,
  },
  {
    id: 'spruce.cut-to-side-bud',
    text: 'On hardened shoots cut just above a side bud and leave no stub: spruce, fir and Douglas fir grow only from buds already there, not from bare wood.',
    source: `${SRC.spruceLateral}; ${SRC.spruceNoAdventitious}`,
  },
  { id: 'spruce.hemlock-latent', text: 'Hemlock carries latent buds further down the stem and takes heavier cutting than spruce.', source: SRC.hemlockLatent },
  {
    id: 'fir.cut-to-side-bud',
    text: 'Firs bud less readily than spruce: shorten only to a visible side bud, and only the strongest shoots; leave weak ones whole.',
    source: `${SRC.spruceLateral}; ${SRC.spruceNoAdventitious}`,
  },

  // Larch
  {
    id: 'larch.shorten-summer',
    text: 'Larch drops its needles each autumn and grows long shoots and short spur shoots. Let long shoots extend, then in summer cut them back to a bud or spur about two or three buds from their base.',
    source: COMMON,
  },
  { id: 'larch.no-published', text: 'No extension or research publication on pruning larch was found: this is trade practice only.', source: COMMON },

  // Yew, podocarp
  {
    id: 'yew.trim-new-growth',
    text: 'Trim new shoots back with scissors once they have grown out, leaving a few leaves of this year’s growth; yew and podocarp regrow even from older wood, so a missed cut can be corrected later.',
    source: SRC.yewOldWood,
  },

  // Cedar
  {
    id: 'cedar.shorten-new',
    text: 'Shorten long new shoots with scissors to a side shoot or a tuft of needles, while they are still soft; leave the short spur shoots alone.',
    source: COMMON,
  },
  { id: 'cedar.no-published', text: 'Candlewise has no published source for cedar technique: treat this as trade practice.', source: COMMON },

  // Groups without a sound rule
  {
    id: 'scope.no-rule',
    text: 'Candlewise has no sound rule for this kind of tree yet, so it does not suggest any cut. Ask an experienced member.',
    source: OURS,
  },

  // Season
  { id: 'season.winter-dormant', text: 'The tree is dormant for winter: there is no growth to work on now.', source: COMMON },
  { id: 'season.out-of-season', text: 'This shoot state is unusual for the season; the answer follows what you saw on the shoot.', source: COMMON },
  { id: 'season.south-shift', text: 'In the southern hemisphere the seasons are six months on from the north (October is mid-spring).', source: COMMON },
  {
    id: 'season.tropics',
    text: 'Your latitude is within the tropics, where calendar seasons do not apply: the answer follows the shoot state you saw.',
    source: OURS,
  },

  // Feeding
  {
    id: 'feed.purpose-refinement',
    text: 'Purpose: steady strength so shortened candles can push new buds, without coarse, long growth. Feed regularly and moderately.',
    source: COMMON,
  },
  { id: 'feed.purpose-development', text: 'Purpose: vigour. Heavy feeding grows the foliage that builds the branch and sets back buds.', source: COMMON },
  {
    id: 'feed.purpose-recovery-collected',
    text: 'Purpose: new roots first. A freshly dug tree cannot use fertiliser until it has new roots; pellets now mostly feed salts around damaged roots. Give none until new roots and new shoots show, then feed very lightly.',
    source: `${SRC.transplantFeed}; ${SRC.transplantFeedNc}`,
  },
  {
    id: 'feed.purpose-recovery-weak',
    text: 'Purpose: rebuild strength gently. A weak tree is fed lightly and steadily; heavy feeding stresses weak roots.',
    source: COMMON,
  },
  {
    id: 'feed.light-feeder',
    text: 'This species grows slowly and needs little feeding: the plan uses fewer, smaller piles than for a vigorous pine.',
    source: COMMON,
  },
  {
    id: 'feed.refinement-pellets',
    text: 'Refinement: organic fertiliser pellets from spring through autumn, about four piles of six to eight pellets for a 40 × 30 cm pot, spaced evenly and halfway between trunk and rim.',
    source: COMMON,
  },
  {
    id: 'feed.development-pellets',
    text: 'Development: heavy feeding, ten to twelve pellets a pile and about twice as many piles as in refinement for the same pot, plus a foliar feed.',
    source: COMMON,
  },
  {
    id: 'feed.not-heavy-in-refinement',
    text: 'The heavy feeding used in development would give long, coarse shoots and needles on a tree in refinement.',
    source: COMMON,
  },
  {
    id: 'feed.hold-back-strong-needle-response',
    text: 'This species’ needles lengthen strongly with feeding: in refinement, feed only once this year’s needles have hardened.',
    source: COMMON,
  },
  {
    id: 'feed.ease-second-flush',
    text: 'After the candles are cut, stop feeding while the second flush extends, so its needles stay short; start again once they have hardened.',
    source: COMMON,
  },
  {
    id: 'feed.why-organic',
    text: 'Why organic pellets: they release a little at a time, and organic matter feeds the soil life, including the root fungi pines depend on for water and nutrients.',
    source: COMMON,
  },
  {
    id: 'feed.pile-scaling',
    text: 'The amount scales with the soil surface of the pot: about 1 200 cm² (40 × 30 cm) gets four piles in refinement and eight in development. Small pots get fewer pellets per pile rather than more pellets per cm². This scaling is our own rule.',
    source: OURS,
  },
  { id: 'feed.mid-sized-pot', text: 'No pot size was given, so the plan is for a mid-sized pot (about 40 × 30 cm).', source: OURS },
  {
    id: 'feed.renew',
    text: 'Pellets about the size of a fingertip (1–2 cm). Replace each pile when it has crumbled away, about every four to six weeks.',
    source: COMMON,
  },
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
  organicFertiliser: {
    text: 'Organic fertiliser attracts dogs and some kinds are harmful if eaten: keep pets and children away from the pot, and wear gloves when handling it.',
    source: COMMON,
  },
  fishEmulsion: {
    text: 'Fish emulsion attracts animals and can upset the stomach if swallowed: store it out of reach of children and pets, and wear gloves when mixing and spraying.',
    source: COMMON,
  },
  wildCollecting: {
    text: 'Collecting from the wild needs the landowner’s permission and any permit local law requires; never collect protected plants.',
    source: COMMON,
  },
  tools: { text: 'Use clean, sharp tools and cut away from your hands; disinfect blades between trees.', source: COMMON },
  labels: { text: 'Follow the directions on the fertiliser label and your local rules; where they differ from this plan, they come first.', source: COMMON },
  strongestOnly: { text: 'Cut only the candles of the strongest areas; leave the rest of the tree untouched this year.', source: COMMON },
  outOfSeason: (shoot: string, season: string) => ({
    text: `A shoot that is “${shoot}” in ${season} is unusual. Check the observation (the date, the hemisphere, and which shoot you looked at) before acting.`,
    source: COMMON,
  }),
} satisfies Record<string, Caution | ((...a: string[]) => Caution)>;
