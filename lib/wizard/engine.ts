import type { WizardSpecies } from '@/lib/validation/species';
import { feedingPlan } from './feeding';
import { CAUTIONS, ENGINE_VERSION, reason, type RuleId } from './rules';
import { dayLength, isEarlySummer, parseIsoDate, resolveHemisphere, resolveLatitude, seasonOf, type SeasonInfo } from './season';
import type { Action, Caution, Reason, ShootState, Stage, WizardContext, WizardInput, WizardResult } from './types';

export const shootLabels: Record<ShootState, string> = {
  'dormant-bud': 'dormant bud',
  'candle-extending': 'candle extending',
  'needles-opening': 'needles opening',
  'needles-hardened': 'needles hardened',
};

export const headlines: Record<Action, string> = {
  pinch: 'Pinch this candle',
  prune: 'Prune the tip',
  'let-grow': 'Let it grow',
  decandle: 'Decandle',
  thin: 'Thin buds and old needles',
  wait: 'Wait: nothing to do now',
};

export function stageOf(input: Pick<WizardInput, 'branching' | 'health' | 'recentlyCollected'>): Stage {
  if (input.recentlyCollected || input.health === 'weak') return 'recovery';
  return input.branching === 'tertiary' ? 'refinement' : 'development';
}

/**
 * A shoot state that does not belong in the season: a candle extending or needles opening in
 * winter or after the first month of autumn, or this year's needles already hard in early spring.
 */
export function isOutOfSeason(shoot: ShootState, s: SeasonInfo): boolean {
  if (shoot === 'candle-extending' || shoot === 'needles-opening') {
    return s.season === 'winter' || (s.season === 'autumn' && s.monthOfSeason > 1);
  }
  if (shoot === 'needles-hardened') return s.season === 'spring' && s.monthOfSeason < 3;
  return false;
}

interface Decision {
  action: Action;
  keep: number | null;
  rules: RuleId[];
  watch: string[];
}

function decide(input: WizardInput, species: WizardSpecies, stage: Stage, s: SeasonInfo): Decision {
  const rules: RuleId[] = [];
  const watch: string[] = [];
  const double = species.flushHabit === 'double';
  const growing = s.season === 'spring' || s.season === 'summer';

  if (stage === 'recovery') {
    if (input.recentlyCollected) rules.push('stage.recovery-collected');
    if (input.health === 'weak') rules.push('stage.recovery-weak');
    rules.push('recover.let-grow');
    if (double && growing) rules.push('flush.no-decandle-weak');
    if (s.season === 'winter' && input.shoot === 'dormant-bud') {
      rules.push('season.winter-dormant');
      watch.push('Watch for the buds to swell in spring, then let them grow.');
      return { action: 'wait', keep: null, rules, watch };
    }
    watch.push('Look for new roots at the drainage holes and firm, dark needles; once the tree is strong, ask again.');
    return { action: 'let-grow', keep: null, rules, watch };
  }

  if (stage === 'development') {
    rules.push('stage.development');
    if (double && growing) rules.push('flush.no-decandle-development');
    if (input.shoot === 'dormant-bud') {
      rules.push(s.season === 'winter' ? 'season.winter-dormant' : 'develop.bud-not-yet');
      watch.push('When the buds extend into candles, let them grow and needle out.');
      return { action: 'wait', keep: null, rules, watch };
    }
    if (input.shoot === 'needles-hardened') {
      if (input.backBuds) {
        rules.push('develop.prune-hardened-with-back-buds');
        watch.push('The back buds behind the cut should candle next spring: let them grow, then the branch moves toward refinement.');
        return { action: 'prune', keep: 2, rules, watch };
      }
      rules.push('develop.wait-for-back-buds', 'develop.let-extend');
      watch.push('Look along older wood for back buds; once they show, prune the tip leaving at least two pairs of needles.');
      return { action: 'let-grow', keep: null, rules, watch };
    }
    rules.push('develop.let-extend', 'develop.no-early-prune');
    watch.push('Once this year’s needles have hardened and back buds show, prune the tip leaving at least two pairs of needles.');
    return { action: 'let-grow', keep: null, rules, watch };
  }

  // Refinement.
  rules.push('stage.refinement');
  const position = input.position ?? 'at-silhouette';
  const strong = input.health === 'strong';

  if (input.shoot === 'dormant-bud') {
    rules.push(s.season === 'winter' ? 'season.winter-dormant' : 'refine.bud-not-yet');
    watch.push('When the buds extend, pinch the candles that push beyond the silhouette while they are still soft single cylinders.');
    return { action: 'wait', keep: null, rules, watch };
  }
  if (position === 'interior') {
    rules.push('refine.interior-let-grow');
    watch.push('Interior shoots gain strength as the outer candles are pinched; leave them be this season.');
    return { action: 'let-grow', keep: null, rules, watch };
  }

  if (double && strong) {
    if (isEarlySummer(s)) {
      rules.push('flush.double-decandle');
      watch.push('New buds should push from the cut within a few weeks; let that second, shorter flush grow.');
      return { action: 'decandle', keep: null, rules, watch };
    }
    if (s.season === 'spring' || s.season === 'winter') {
      rules.push('flush.double-wait-for-early-summer');
      watch.push('Decandle in early summer, once the spring candles have extended.');
      return { action: 'wait', keep: null, rules, watch };
    }
    rules.push('flush.double-decandle-window-passed');
    watch.push('Next year, decandle in early summer once the spring candles have extended.');
    return { action: 'wait', keep: null, rules, watch };
  }

  if (double && growing) rules.push('flush.double-not-strong');
  if (!double && growing) rules.push('flush.single-never-decandle');

  if (position === 'at-silhouette') {
    rules.push('refine.at-silhouette-nothing');
    watch.push('Check it every few days; pinch once it pushes beyond the silhouette, while still a soft cylinder.');
    return { action: 'wait', keep: null, rules, watch };
  }

  if (input.shoot === 'candle-extending') {
    rules.push('refine.pinch-soft-candle', 'refine.pinch-auxin', double ? 'refine.keep-part-of-candle' : 'refine.keep-two-pairs-single-flush');
    watch.push('The buds behind the pinch will extend in two to three weeks; pinch them when they pass the silhouette.');
    if (!double && s.season === 'spring' && (species.vigour === 'high' || strong)) {
      rules.push('refine.successive-elongations');
      watch.push('On a vigorous tree expect up to three elongations this spring: pinch each as it passes the silhouette.');
    }
    return { action: 'pinch', keep: 2, rules, watch };
  }
  if (input.shoot === 'needles-opening') {
    rules.push('refine.too-late-needles-open');
    watch.push('Let it harden. Next spring, pinch this shoot while the candle is still a soft single cylinder.');
    return { action: 'wait', keep: null, rules, watch };
  }
  rules.push('refine.hardened-nothing-to-pinch');
  watch.push('Next spring, pinch this shoot’s candle when it passes the silhouette, while still soft.');
  return { action: 'wait', keep: null, rules, watch };
}

const ASIDE_RULES = new Set<RuleId>(['flush.single-never-decandle', 'flush.no-decandle-development', 'flush.no-decandle-weak', 'flush.double-not-strong']);

export class WizardInputError extends Error {
  constructor(readonly field: string, message: string) {
    super(message);
  }
}

/** The decision: one action with every rule that fired, cautions, a feeding plan and day length. */
export function evaluate(input: WizardInput, species: WizardSpecies, context: WizardContext): WizardResult {
  const iso = input.date ?? context.today;
  const date = parseIsoDate(iso);
  if (!date) throw new WizardInputError('date', 'Give the date as YYYY-MM-DD.');
  const hemisphere = resolveHemisphere(input, context);
  const latitude = resolveLatitude(input, hemisphere, context);
  const s = seasonOf(date, hemisphere);
  const stage = stageOf(input);

  const reasons: Reason[] = [];
  const cautions: Caution[] = [];
  if (species.group !== 'pine') reasons.push(reason('scope.not-a-pine'));
  if (hemisphere === 'south') reasons.push(reason('season.south-shift'));

  const d = decide(input, species, stage, s);
  // The rules that decided come first; the ones that only explain what is not done follow.
  const aside = (id: RuleId) => ASIDE_RULES.has(id);
  for (const id of [...d.rules.filter((r) => !aside(r)), ...d.rules.filter(aside)]) reasons.push(reason(id));

  if (isOutOfSeason(input.shoot, s)) {
    reasons.push(reason('season.out-of-season'));
    cautions.push(CAUTIONS.outOfSeason(shootLabels[input.shoot], s.season));
  }

  const fertilizer = feedingPlan({
    stage, season: s.season, shoot: input.shoot, species, container: input.container,
    recentlyCollected: input.recentlyCollected, weak: input.health === 'weak',
  });
  const watch = [...d.watch];
  if (!fertilizer.feedNow && s.season !== 'winter') watch.push('Start feeding once this year’s needles have hardened.');

  if (d.action === 'prune' || d.action === 'decandle') cautions.push(CAUTIONS.tools);
  cautions.push(CAUTIONS.organicFertiliser);
  if (fertilizer.foliar) cautions.push(CAUTIONS.fishEmulsion);
  if (input.recentlyCollected) cautions.push(CAUTIONS.wildCollecting);
  for (const c of species.cautions) cautions.push({ text: c.text, source: c.source });
  cautions.push(CAUTIONS.labels);

  const headline =
    d.action === 'pinch' || d.action === 'prune'
      ? `${headlines[d.action]}: leave at least ${d.keep} pairs of needles`
      : headlines[d.action];

  return {
    action: d.action,
    stage,
    season: s.season,
    keepNeedlePairs: d.keep,
    candleKeep: null,
    keepNeedleBundles: d.keep,
    howTo: [],
    terms: [],
    reasons,
    cautions,
    fertilizer,
    engineVersion: ENGINE_VERSION,
    speciesRevision: species.revision,
    headline,
    watch,
    hemisphere,
    dayLength: dayLength(date, latitude),
    date: iso,
    speciesSlug: species.slug,
    speciesName: species.commonName,
  };
}
