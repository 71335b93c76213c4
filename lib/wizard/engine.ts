import type { WizardSpecies } from '@/lib/validation/species';
import { decandleWindowPosition, DECANDLE_MIN_DEGREE_DAYS, TROPIC_LATITUDE, type WindowPosition } from './decandle-window';
import { candleKeepText, fractionWords } from './candle-keep';
import { feedingPlan } from './feeding';
import { bundleWord, isPine, techniqueOf, type Technique } from './groups';
import { CAUTIONS, ENGINE_VERSION, reason, type RuleId } from './rules';
import { dayLength, parseIsoDate, resolveHemisphere, resolveLatitude, seasonOf, type SeasonInfo } from './season';
import { termsIn } from './terms';
import type { Action, CandleStrength, Caution, Reason, ShootState, Stage, WizardContext, WizardInput, WizardResult } from './types';

export const shootLabels: Record<ShootState, string> = {
  'dormant-bud': 'dormant bud',
  'candle-extending': 'candle extending',
  'needles-opening': 'needles opening',
  'needles-hardened': 'needles hardened',
};

/** Headlines that fit every group; group-specific ones are built in `headlineFor`. */
export const headlines: Record<Action, string> = {
  pinch: 'Shorten this new shoot',
  prune: 'Cut this shoot back',
  'let-grow': 'Let it grow',
  decandle: 'Cut this year’s candles off (decandle)',
  thin: 'Select buds and thin old needles',
  wait: 'Wait: nothing to do now',
};

export function stageOf(input: Pick<WizardInput, 'branching' | 'health' | 'recentlyCollected'>): Stage {
  if (input.recentlyCollected || input.health === 'weak') return 'recovery';
  return input.branching === 'tertiary' ? 'refinement' : 'development';
}

/**
 * A shoot state that does not belong in the season: a shoot lengthening in winter or autumn, or
 * this year's needles already hard in early spring. Never within the tropics.
 */
export function isOutOfSeason(shoot: ShootState, s: SeasonInfo, tropics = false): boolean {
  if (tropics) return false;
  if (shoot === 'candle-extending' || shoot === 'needles-opening') return s.season === 'winter' || s.season === 'autumn';
  if (shoot === 'needles-hardened') return s.season === 'spring' && s.monthOfSeason < 3;
  return false;
}

export class WizardInputError extends Error {
  constructor(
    readonly field: string,
    message: string,
    readonly fields: Record<string, string[]> = { [field]: [message] },
  ) {
    super(message);
  }
}

/** Fraction of the candle to leave, by how strong it is against the others. null: leave it whole. */
function candleKeepFor(technique: Technique, strength: CandleStrength): { min: number; max: number } | null {
  if (strength === 'weak') return null;
  if (technique === 'pine-five') return strength === 'strong' ? { min: 0.5, max: 0.67 } : { min: 0.67, max: 0.75 };
  // Published: remove about half to two-thirds of a candle, i.e. keep a third to a half.
  return strength === 'strong' ? { min: 0.33, max: 0.5 } : { min: 0.5, max: 0.67 };
}

/** Needle bundles to leave below a cut on a hardened pine shoot: strong shoots are cut harder. */
function bundlesToKeep(strength: CandleStrength): number {
  return strength === 'strong' ? 2 : strength === 'average' ? 3 : 4;
}

interface Decision {
  action: Action;
  candleKeep: { min: number; max: number } | null;
  bundles: number | null;
  rules: RuleId[];
  watch: string[];
  howTo: string[];
  cautions: Caution[];
}

interface Ctx {
  input: WizardInput;
  species: WizardSpecies;
  technique: Technique;
  stage: Stage;
  s: SeasonInfo;
  tropics: boolean;
  window: WindowPosition;
  strength: CandleStrength;
}

const make = (action: Action, rules: RuleId[], watch: string[], howTo: string[] = [], extra: Partial<Decision> = {}): Decision => ({
  action,
  candleKeep: null,
  bundles: null,
  rules,
  watch,
  howTo,
  cautions: [],
  ...extra,
});

/** Late summer, autumn, or (in the tropics) whenever growth has hardened: the time for autumn work. */
const isLate = (c: Ctx) => c.tropics || c.s.season === 'autumn' || (c.s.season === 'summer' && c.s.monthOfSeason === 3);
const isWinter = (c: Ctx) => !c.tropics && c.s.season === 'winter';
// Winter dormancy decides only when the shoot agrees: a shoot seen extending in winter is answered
// from what was seen, with the out-of-season caution.
const dormantNow = (c: Ctx) => isWinter(c) && (c.input.shoot === 'dormant-bud' || c.input.shoot === 'needles-hardened');
const growing = (c: Ctx) => c.tropics || c.s.season === 'spring' || c.s.season === 'summer';

function bundlesPhrase(c: Ctx, n: number): string {
  return `${n} ${bundleWord(c.species.needlesPerFascicle, n !== 1) ?? 'needle bundles'}`;
}

// ---- Recovery and development: the same for every group, worded for each ----

function recovery(c: Ctx): Decision {
  const rules: RuleId[] = [];
  if (c.input.recentlyCollected) rules.push('stage.recovery-collected');
  if (c.input.health === 'weak') rules.push('stage.recovery-weak');
  rules.push('recover.let-grow');
  if (c.technique === 'pine-double' && growing(c)) rules.push('flush.no-decandle-weak');
  if (isWinter(c)) {
    rules.push('season.winter-dormant');
    return make('wait', rules, ['Watch for the buds to swell in spring, then let them grow.']);
  }
  return make(
    'let-grow',
    rules,
    ['Look for new roots at the drainage holes and firm, well-coloured new growth; once the tree is strong, ask again.'],
    [
      'Leave every shoot on the tree; do not cut, pinch or pull anything.',
      'Keep the tree out of strong wind and the hottest afternoon sun while it rebuilds roots.',
      'Water when the surface of the soil starts to dry; do not keep it soaking wet.',
    ],
  );
}

function development(c: Ctx): Decision {
  const rules: RuleId[] = ['stage.development'];
  const pine = isPine(c.technique);
  if (c.technique === 'pine-double' && growing(c)) rules.push('flush.no-decandle-development');
  if (c.technique === 'unknown') return make('wait', [...rules, 'scope.no-rule'], []);
  if (c.input.shoot === 'dormant-bud' || dormantNow(c)) {
    rules.push(isWinter(c) ? 'season.winter-dormant' : 'develop.bud-not-yet');
    return make('wait', rules, ['When the buds grow into new shoots, let them grow and needle out.']);
  }
  if (c.input.shoot !== 'needles-hardened') {
    rules.push('develop.let-extend', 'develop.no-early-prune');
    return make(
      'let-grow',
      rules,
      ['Once this year’s growth has hardened and back buds show on older wood, the long shoot can be cut back to them.'],
      ['Leave the new shoot to lengthen fully; do not pinch it.', 'Feed well so the foliage grows strong.'],
    );
  }
  if (!c.input.backBuds || c.s.season === 'spring') {
    rules.push('develop.wait-for-back-buds', 'develop.let-extend');
    return make('let-grow', rules, ['Look along the older wood for back buds; once they show, cut the long shoot back to just beyond them.']);
  }
  rules.push('develop.prune-hardened-with-back-buds');
  const howTo = pine
    ? [
        'Find the back buds on the older part of the branch.',
        `With sharp scissors, cut the long shoot just beyond the outermost back bud you want, leaving ${bundlesPhrase(c, 2)} or more beyond it.`,
        'Never cut into wood that has no needles left: a pine does not regrow from bare wood.',
      ]
    : c.technique === 'scale-foliage'
      ? [
          'With sharp scissors, cut the long shoot back to a fork or side shoot near the new buds, keeping green foliage beyond the cut.',
          'Never cut back into the bare inner part of the branch.',
        ]
      : [
          'Find the new buds or side shoots on the older part of the branch.',
          'With sharp scissors, cut just above the outermost one you want to keep; leave no stub.',
          'Keep foliage beyond every cut.',
        ];
  if (pine) rules.push('pine.no-bare-wood');
  if (c.technique === 'scale-foliage') rules.push('scale.keep-green');
  return make('prune', rules, ['The buds behind the cut should grow next spring: let them grow, then the branch moves toward refinement.'], howTo, {
    bundles: pine ? 2 : null,
  });
}

// ---- Refinement, per group ----

function pineRefinement(c: Ctx): Decision {
  const rules: RuleId[] = ['stage.refinement'];
  const { input, technique } = c;
  const position = input.position ?? 'at-silhouette';
  const strong = input.health === 'strong';
  // A double-flush pine where a second flush cannot harden is worked as a single-flush one.
  const double = technique === 'pine-double' && c.window !== 'none';
  const decandleAsides = (): RuleId[] => {
    if (!growing(c)) return [];
    if (technique === 'pine-double' && c.window === 'none') return ['flush.double-no-window'];
    if (double && input.repottedThisYear) return ['flush.no-decandle-repotted'];
    if (!double) return ['flush.single-never-decandle'];
    return [];
  };

  if (position === 'interior' && input.shoot !== 'needles-hardened') {
    rules.push('pine.interior-let-grow', ...decandleAsides());
    return make('let-grow', rules, ['Interior shoots gain strength while the outer ones are reduced; leave them be this season.']);
  }
  if (dormantNow(c)) {
    rules.push('season.winter-dormant');
    return make('wait', rules, ['In spring, shorten the candles that push beyond the silhouette while they are still soft.']);
  }

  if (input.shoot === 'dormant-bud') {
    if (c.s.season === 'autumn' && position !== 'interior') return pineAutumn(c, rules);
    rules.push('pine.bud-not-yet');
    return make('wait', rules, ['When the buds lengthen into candles, shorten the ones that push beyond the silhouette while they are still soft.']);
  }

  // Cutting this year's candles on a strong (or, for its strongest candles, average) double-flush pine.
  const decandleDecision = (): Decision | null => {
    if (!double || input.repottedThisYear) return null;
    if (!strong && !(input.health === 'average')) return null;
    if (input.health === 'average') {
      if (c.strength !== 'strong') {
        rules.push('flush.double-average-leave');
        return make('let-grow', rules, ['Next year, on a strong tree, the candles can be cut once they have finished lengthening.']);
      }
    }
    if (c.window === 'before') {
      rules.push('flush.double-window-not-yet');
      return make('wait', rules, ['Cut the candles when your window opens, if they have finished lengthening by then.']);
    }
    if (c.window === 'after') {
      rules.push('flush.double-window-passed');
      return null;
    }
    if (typeof input.degreeDays === 'number' && input.degreeDays < DECANDLE_MIN_DEGREE_DAYS) {
      rules.push('flush.double-degree-days-low');
      return make('wait', rules, ['Check again in a week: cut the candles once they have stopped lengthening.']);
    }
    if (c.tropics) rules.push('flush.double-tropics');
    rules.push('flush.double-decandle');
    const cautions: Caution[] = [];
    if (input.health === 'average') {
      rules.push('flush.double-average-strongest-only');
      cautions.push(CAUTIONS.strongestOnly);
    }
    return make(
      'decandle',
      rules,
      ['New buds should appear at the cut ends within three to four weeks; in autumn reduce them to two per tip.'],
      [
        'Work on a dry day, strongest areas last: cut the candles of the weakest areas first, those of the strongest areas about a week later.',
        'Hold the candle and cut it with sharp scissors just above last year’s needles, leaving a short stub on the weak candles and almost none on the strongest.',
        'Leave every older needle in place: the tree needs them to push the second flush.',
        'Keep watering and sun as usual; do not feed until the new shoots have hardened.',
      ],
      { cautions },
    );
  };

  if (input.shoot === 'candle-extending') {
    if (double && (strong || input.health === 'average') && !input.repottedThisYear && c.window !== 'after') {
      rules.push('flush.double-wait-candles-extending');
      return make(
        'let-grow',
        rules,
        ['Once the candles stop lengthening and their needles begin to open, ask again: that is when they are cut.'],
        ['Leave the candles to lengthen; do not shorten them.'],
      );
    }
    if (position === 'at-silhouette') {
      rules.push('refine.at-silhouette-nothing', ...decandleAsides());
      return make('wait', rules, ['Check it every few days; shorten it once it pushes beyond the silhouette, while it is still soft.']);
    }
    const keep = candleKeepFor(technique, c.strength);
    if (!keep) {
      rules.push('pine.weak-candle-leave', ...decandleAsides());
      if (technique === 'pine-five') rules.push('pine.five-needle-light');
      return make('let-grow', rules, ['A weak candle left whole gains strength for next year.']);
    }
    rules.push('pine.shorten-soft-candle', 'pine.candle-fraction');
    if (technique === 'pine-five') rules.push('pine.five-needle-light');
    if (technique === 'pine-multinodal') rules.push('pine.multinodal-whorl');
    if (!double) rules.push('pine.never-whole-single');
    const watch = ['New buds form near the cut over the next weeks; they grow next spring.'];
    const successive =
      technique === 'pine-single' && c.species.needlesPerFascicle === 2 && c.species.vigour !== 'low' && strong && c.s.season === 'spring' && !c.tropics;
    if (successive) {
      rules.push('pine.successive-elongations');
      watch.push('The buds behind the pinch may lengthen in two to three weeks; shorten them too when they pass the silhouette.');
    }
    rules.push(...decandleAsides());
    const howTo = [
      'Work on the strongest areas first, the weaker ones a few days later, and leave the weakest candles whole.',
      technique === 'pine-multinodal'
        ? `Find the whorl of small buds on the candle nearest to ${fractionWords(keep)} of its length from the base, and pinch or cut just above it.`
        : `Hold the candle near its base; with finger and thumb (or fine scissors on a thick candle) snap it off so that ${fractionWords(keep)} of its length stays.`,
      'Do not crush the stub or strip needles from it.',
    ];
    return make('pinch', rules, watch, howTo, { candleKeep: keep });
  }

  if (input.shoot === 'needles-opening') {
    const d = decandleDecision();
    if (d) return d;
    rules.push('pine.too-late-needles-open', ...decandleAsides());
    return make('wait', rules, ['Let it harden. In late summer or autumn, cut it back to a bud or a few needle bundles if it reaches beyond the silhouette.']);
  }

  // Needles hardened.
  if (c.s.season === 'summer' || c.tropics || c.s.season === 'spring') {
    const d = decandleDecision();
    if (d) return d;
  }
  if (isLate(c) && position !== 'interior') return pineAutumn(c, rules);
  if (isLate(c)) {
    rules.push('pine.interior-let-grow');
    return make('let-grow', rules, ['Interior shoots are kept: in autumn, only thin the old needles around them so they get light.']);
  }
  rules.push('pine.hardened-summer-wait', ...decandleAsides());
  return make('wait', rules, ['From late summer, shoots beyond the silhouette can be cut back to a bud or a few needle bundles, and buds selected.']);
}

function pineAutumn(c: Ctx, rules: RuleId[]): Decision {
  const position = c.input.position ?? 'at-silhouette';
  if (c.technique === 'pine-double') {
    rules.push('pine.double-autumn-thin');
    return make(
      'thin',
      rules,
      ['In spring, let the candles lengthen; ask again when they stop.'],
      [
        'At each tip where the second flush pushed several buds, keep two of about equal size and remove the others by twisting them off or snipping at the base.',
        'In the strongest areas, pull out last year’s needles and thin this year’s to about a few bundles per shoot; leave the weak areas fuller.',
        'Pull needles in the direction they grow, or cut them just above their sheath, so the buds at their base survive.',
      ],
    );
  }
  if (c.technique === 'pine-five') {
    rules.push('pine.five-autumn-light');
    return make(
      'thin',
      rules,
      ['In spring, reduce only the strongest candles, and lightly.'],
      [
        'Where more than two buds crowd a tip, remove the extras, keeping two of moderate size.',
        'Pull only the oldest, yellowing needles; keep the green ones.',
        'Leave every weak shoot as it is.',
      ],
    );
  }
  if (position === 'beyond-silhouette' && c.strength !== 'weak') {
    const n = bundlesToKeep(c.strength);
    rules.push('pine.autumn-cut-back', 'pine.no-bare-wood');
    return make(
      'prune',
      rules,
      ['Next spring, shorten the new candles on this shoot while they are soft.'],
      [
        'Find a bud, or a point where you can leave needles, nearer the trunk than the silhouette.',
        `Cut with sharp scissors just above it, leaving at least ${bundlesPhrase(c, n)} on the shoot below the cut.`,
        'Never cut into wood with no needles left.',
      ],
      { bundles: n },
    );
  }
  rules.push('pine.autumn-thin');
  return make(
    'thin',
    rules,
    ['Next spring, shorten the candles that push beyond the silhouette while they are soft.'],
    [
      'Where several buds crowd a tip, keep two and remove the strongest and the weakest.',
      'Pull out the old needles from earlier years, and in strong areas thin this year’s too, so light reaches the inner buds.',
      'Pull needles in the direction they grow, or cut them above the sheath, so the buds at their base survive.',
    ],
  );
}

function scaleRefinement(c: Ctx): Decision {
  const rules: RuleId[] = ['stage.refinement'];
  const position = c.input.position ?? 'at-silhouette';
  if (dormantNow(c) || c.input.shoot === 'dormant-bud') {
    rules.push(isWinter(c) ? 'season.winter-dormant' : 'develop.bud-not-yet');
    return make('wait', rules, ['When new growth extends in spring, trim the long shoots to a fork with scissors.']);
  }
  if (position === 'interior') {
    rules.push('scale.interior-let-grow');
    return make('let-grow', rules, ['Keep inner shoots: they hold foliage close to the trunk.']);
  }
  const active = c.input.shoot !== 'needles-hardened' || (c.s.season === 'summer' && c.s.monthOfSeason === 1);
  if (!active || c.s.season === 'autumn') {
    rules.push('scale.not-while-hardening');
    return make('wait', rules, ['Trim again when new growth is active next spring.']);
  }
  if (position === 'at-silhouette') {
    rules.push('refine.at-silhouette-nothing');
    return make('wait', rules, ['Trim it once it grows out beyond the outline.']);
  }
  rules.push('scale.trim-to-fork', 'scale.keep-green');
  return make(
    'prune',
    rules,
    ['New shoots will grow from the fork you kept; trim them the same way when they grow long.'],
    [
      'Follow the long shoot back to a fork or side shoot that has green foliage beyond it, inside the outline.',
      'Cut just above that fork with sharp, fine scissors.',
      'Do not shear across the foliage and do not pull the soft tips off with your fingers.',
      'Always leave green growth at the end of the branch.',
    ],
  );
}

function spruceRefinement(c: Ctx): Decision {
  const rules: RuleId[] = ['stage.refinement'];
  const position = c.input.position ?? 'at-silhouette';
  const fir = c.technique === 'fir';
  const hemlock = c.species.group === 'hemlock';
  if (dormantNow(c) || c.input.shoot === 'dormant-bud') {
    rules.push(isWinter(c) ? 'season.winter-dormant' : 'develop.bud-not-yet');
    return make('wait', rules, ['When the buds open and the new shoots lengthen, shorten the strong ones beyond the outline.']);
  }
  if (position === 'interior' || (fir && c.strength === 'weak')) {
    rules.push('scale.interior-let-grow');
    return make('let-grow', rules, ['Inner and weak shoots are left to gain strength.']);
  }
  if (position === 'at-silhouette') {
    return make('wait', [...rules, 'refine.at-silhouette-nothing'], ['Shorten it only once it grows beyond the outline.']);
  }
  if (c.input.shoot !== 'needles-hardened') {
    if (c.strength === 'weak') return make('let-grow', [...rules, 'refine.weak-shoot-leave'], ['A weak shoot is left whole to gain strength.']);
    rules.push(fir ? 'fir.cut-to-side-bud' : 'spruce.shorten-extending');
    if (hemlock) rules.push('spruce.hemlock-latent');
    return make(
      'pinch',
      rules,
      ['Side buds along the remaining part of the shoot grow next year.'],
      [
        'Strongest shoots first; leave weak ones whole.',
        fir
          ? 'Cut just above a visible side bud on the new shoot, with fine scissors.'
          : 'Pinch or cut off about half of the soft new shoot, leaving its base with its needles and side buds.',
        'Do not cut back into wood without needles.',
      ],
    );
  }
  if (!isLate(c)) {
    return make('wait', [...rules, 'scale.not-while-hardening'], ['In late summer or autumn, long hardened shoots can be cut back to a side bud.']);
  }
  rules.push('spruce.cut-to-side-bud');
  if (hemlock) rules.push('spruce.hemlock-latent');
  return make(
    'prune',
    rules,
    ['The side bud you cut to becomes the new tip next spring.'],
    [
      'Find a side bud, or a side shoot, pointing the way you want the branch to grow.',
      'Cut just above it with sharp scissors and leave no stub.',
      'Never cut back into bare wood: spruce and fir do not regrow from it.',
    ],
  );
}

function larchRefinement(c: Ctx): Decision {
  const rules: RuleId[] = ['stage.refinement', 'larch.no-published'];
  const position = c.input.position ?? 'at-silhouette';
  if (dormantNow(c) || c.input.shoot === 'dormant-bud' || c.s.season === 'autumn') {
    rules.push(isWinter(c) ? 'season.winter-dormant' : 'develop.bud-not-yet');
    return make('wait', rules, ['Next summer, once the long shoots have grown out, shorten them to a bud or spur.']);
  }
  if (position === 'interior') return make('let-grow', [...rules, 'scale.interior-let-grow'], ['Leave inner shoots to gain strength.']);
  if (c.input.shoot === 'candle-extending' || c.s.season === 'spring' || position === 'at-silhouette') {
    rules.push('develop.let-extend');
    return make('let-grow', rules, ['Let the long shoot grow out; in summer shorten it to two or three buds from its base.']);
  }
  rules.push('larch.shorten-summer');
  return make(
    'prune',
    rules,
    ['Spurs and buds below the cut grow next spring.'],
    [
      'Count two or three buds or spur shoots from the base of this year’s long shoot.',
      'Cut just beyond the last one with sharp scissors.',
      'Leave the short spur shoots along older wood alone.',
    ],
  );
}

function yewRefinement(c: Ctx): Decision {
  const rules: RuleId[] = ['stage.refinement'];
  const position = c.input.position ?? 'at-silhouette';
  if (dormantNow(c) || c.input.shoot === 'dormant-bud') {
    rules.push(isWinter(c) ? 'season.winter-dormant' : 'develop.bud-not-yet');
    return make('wait', rules, ['Once this year’s shoots have grown out, trim them back with scissors.']);
  }
  if (position === 'interior') return make('let-grow', [...rules, 'scale.interior-let-grow'], ['Leave inner shoots.']);
  if (c.input.shoot === 'candle-extending' || c.s.season === 'autumn' || position === 'at-silhouette') {
    rules.push(c.s.season === 'autumn' ? 'scale.not-while-hardening' : 'develop.let-extend');
    return make(c.s.season === 'autumn' ? 'wait' : 'let-grow', rules, ['Trim new shoots after they have grown out, in early summer.']);
  }
  rules.push('yew.trim-new-growth');
  return make(
    'prune',
    rules,
    ['New shoots grow again from the cut; trim them the same way next year.'],
    [
      'With sharp scissors, cut each long new shoot back, leaving a few leaves of this year’s growth.',
      'Follow the outline you want; yew and podocarp regrow even from older wood.',
      'Yew leaves and seeds are poisonous: keep clippings away from children and animals.',
    ],
  );
}

function cedarRefinement(c: Ctx): Decision {
  const rules: RuleId[] = ['stage.refinement', 'cedar.no-published'];
  const position = c.input.position ?? 'at-silhouette';
  if (dormantNow(c) || c.input.shoot === 'dormant-bud') {
    rules.push(isWinter(c) ? 'season.winter-dormant' : 'develop.bud-not-yet');
    return make('wait', rules, ['When new shoots lengthen, shorten the long ones with scissors.']);
  }
  if (position !== 'beyond-silhouette' || c.strength === 'weak')
    return make('let-grow', [...rules, position === 'interior' ? 'scale.interior-let-grow' : 'refine.weak-shoot-leave'], ['Leave it to grow.']);
  if (c.input.shoot === 'needles-hardened') {
    return make('wait', [...rules, 'scale.not-while-hardening'], ['Next spring, shorten long new shoots while they are soft.']);
  }
  rules.push('cedar.shorten-new');
  return make(
    'prune',
    rules,
    ['Short spur shoots behind the cut thicken the foliage.'],
    ['With fine scissors, cut the long soft shoot back to a side shoot or tuft of needles inside the outline.', 'Leave the short spur shoots alone.'],
  );
}

function decide(c: Ctx): Decision {
  if (c.stage === 'recovery') return recovery(c);
  if (c.stage === 'development') return development(c);
  switch (c.technique) {
    case 'pine-single':
    case 'pine-multinodal':
    case 'pine-double':
    case 'pine-five':
      return pineRefinement(c);
    case 'scale-foliage':
      return scaleRefinement(c);
    case 'spruce':
    case 'fir':
      return spruceRefinement(c);
    case 'larch':
      return larchRefinement(c);
    case 'yew':
      return yewRefinement(c);
    case 'cedar':
      return cedarRefinement(c);
    default:
      return make('wait', ['stage.refinement', 'scope.no-rule'], []);
  }
}

const ASIDE_RULES = new Set<RuleId>([
  'flush.single-never-decandle',
  'flush.no-decandle-development',
  'flush.no-decandle-weak',
  'flush.no-decandle-repotted',
  'flush.double-no-window',
  'larch.no-published',
  'cedar.no-published',
]);

function headlineFor(d: Decision, c: Ctx): string {
  const pine = isPine(c.technique);
  switch (d.action) {
    case 'pinch':
      if (pine && d.candleKeep) return `Shorten this candle: ${candleKeepText(d.candleKeep)}`;
      return c.technique === 'fir' ? 'Shorten this new shoot to a side bud' : 'Shorten this new shoot by about half';
    case 'prune':
      if (pine && d.bundles !== null) return `Cut this shoot back, leaving at least ${bundlesPhrase(c, d.bundles)}`;
      if (c.technique === 'scale-foliage') return 'Trim this shoot to a fork with scissors';
      if (c.technique === 'spruce' || c.technique === 'fir') return 'Cut this shoot back to a side bud';
      if (c.technique === 'larch') return 'Shorten this long shoot to a bud or spur';
      if (c.technique === 'yew') return 'Trim this year’s growth';
      return 'Shorten this new shoot with scissors';
    case 'wait':
      return c.technique === 'unknown' ? 'No rule for this tree yet: wait' : headlines.wait;
    default:
      return headlines[d.action];
  }
}

function dedupe(cautions: Caution[]): Caution[] {
  const seen = new Set<string>();
  const key = (t: string) =>
    t
      .toLowerCase()
      .replace(/[^a-z]+/g, ' ')
      .trim();
  return cautions.filter((c) => {
    const k = key(c.text);
    // A species caution about collecting from the wild says what the general one says.
    const topic = /collect(ing|ed)? (from )?the wild|wild[- ]collect/i.test(c.text) ? 'wild-collecting' : k;
    if (seen.has(topic)) return false;
    seen.add(topic);
    return true;
  });
}

/** The decision: one action with every rule that fired, cautions, a feeding plan and day length. */
export function evaluate(input: WizardInput, species: WizardSpecies, context: WizardContext): WizardResult {
  const iso = input.date ?? context.today;
  const date = parseIsoDate(iso);
  if (!date) throw new WizardInputError('date', 'Give the date as YYYY-MM-DD.');
  if (input.hemisphere && typeof input.latitude === 'number' && input.latitude !== 0 && input.latitude < 0 !== (input.hemisphere === 'south')) {
    const msg = `A ${input.hemisphere}ern hemisphere and a latitude of ${input.latitude}° disagree: give a ${input.hemisphere === 'south' ? 'negative' : 'positive'} latitude, or the other hemisphere.`;
    throw new WizardInputError('hemisphere', msg, { hemisphere: [msg], latitude: [msg] });
  }
  const hemisphere = resolveHemisphere(input, context);
  const latitude = resolveLatitude(input, hemisphere, context);
  const s = seasonOf(date, hemisphere);
  const stage = stageOf(input);
  const technique = techniqueOf(species);
  const tropics = Math.abs(latitude) < TROPIC_LATITUDE;
  const c: Ctx = {
    input,
    species,
    technique,
    stage,
    s,
    tropics,
    window: decandleWindowPosition(date, hemisphere, latitude, context.decandleOffsetDays ?? 0),
    strength: input.candleStrength ?? 'average',
  };

  const reasons: Reason[] = [];
  if (tropics) reasons.push(reason('season.tropics'));
  else if (hemisphere === 'south') reasons.push(reason('season.south-shift'));

  const d = decide(c);
  const aside = (id: RuleId) => ASIDE_RULES.has(id);
  const ordered = [...new Set([...d.rules.filter((r) => !aside(r)), ...d.rules.filter(aside)])];
  for (const id of ordered) reasons.push(reason(id));

  const cautions: Caution[] = [...d.cautions];
  if (isOutOfSeason(input.shoot, s, tropics)) {
    reasons.push(reason('season.out-of-season'));
    cautions.push(CAUTIONS.outOfSeason(shootLabels[input.shoot], s.season));
  }

  const fertilizer = feedingPlan({
    stage,
    season: s.season,
    shoot: input.shoot,
    species,
    technique,
    container: input.container,
    recentlyCollected: input.recentlyCollected,
    weak: input.health === 'weak',
    tropics,
    secondFlush:
      technique === 'pine-double' &&
      stage === 'refinement' &&
      !input.repottedThisYear &&
      c.window !== 'none' &&
      (d.action === 'decandle' || (c.window === 'after' && s.season === 'summer')),
  });
  const watch = [...d.watch];
  if (!fertilizer.feedNow && fertilizer.resumeWhen) watch.push(fertilizer.resumeWhen);

  if (d.action === 'prune' || d.action === 'decandle' || d.action === 'thin' || d.action === 'pinch') cautions.push(CAUTIONS.tools);
  if (fertilizer.feedNow || fertilizer.piles !== null) cautions.push(CAUTIONS.organicFertiliser);
  if (fertilizer.foliar) cautions.push(CAUTIONS.fishEmulsion);
  if (input.recentlyCollected) cautions.push(CAUTIONS.wildCollecting);
  for (const sc of species.cautions) cautions.push({ text: sc.text, source: sc.source });
  cautions.push(CAUTIONS.labels);

  const headline = headlineFor(d, c);
  const keepNeedleBundles = isPine(technique) ? d.bundles : null;
  const terms = termsIn([headline, ...d.howTo, ...reasons.map((r) => r.text), ...watch]);

  return {
    action: d.action,
    stage,
    season: s.season,
    keepNeedlePairs: species.needlesPerFascicle === 2 ? keepNeedleBundles : null,
    candleKeep: isPine(technique) ? d.candleKeep : null,
    keepNeedleBundles,
    howTo: d.howTo,
    terms,
    reasons,
    cautions: dedupe(cautions),
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
