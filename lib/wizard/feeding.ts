import type { WizardSpecies } from '@/lib/validation/species';
import { describeContainer, surfaceAreaCm2 } from './container';
import type { Technique } from './groups';
import { reason } from './rules';
import type { ContainerInput, FertilizerPlan, Reason, Season, ShootState, Stage } from './types';

/** The pot the pile counts are calibrated on: about 1 200 cm² of soil (40 × 30 cm). */
export const REFERENCE_SURFACE_CM2 = 1200;
export const REFERENCE_PILES = { light: 3, moderate: 4, heavy: 8 } as const;

export const PELLETS = {
  light: { min: 3, max: 4 },
  moderate: { min: 6, max: 8 },
  heavy: { min: 10, max: 12 },
} as const;
export type Regime = keyof typeof PELLETS;

export const PELLET_SIZE = 'pellets about the size of a fingertip (1–2 cm across)';
export const RENEW_WEEKS = { min: 4, max: 6 } as const;

/** Pellets per cm² of soil at the reference pot: the density every pot size keeps. */
export function referenceDensity(regime: Regime): number {
  const p = PELLETS[regime];
  return (REFERENCE_PILES[regime] * ((p.min + p.max) / 2)) / REFERENCE_SURFACE_CM2;
}

/**
 * Piles and pellets for a soil surface, keeping the reference pot's density of pellets per cm².
 * A pot too small for one full pile gets one pile of fewer pellets. Our own rule.
 */
export function pilesForSurface(surfaceCm2: number, regime: Regime): { piles: number; pellets: { min: number; max: number } } {
  const exact = (REFERENCE_PILES[regime] * surfaceCm2) / REFERENCE_SURFACE_CM2;
  const p = PELLETS[regime];
  if (exact >= 1) return { piles: Math.round(exact), pellets: { ...p } };
  return {
    piles: 1,
    pellets: { min: Math.max(1, Math.floor(p.min * exact)), max: Math.max(1, Math.round(p.max * exact)) },
  };
}

export interface FeedingInput {
  stage: Stage;
  season: Season;
  shoot: ShootState;
  species: WizardSpecies;
  technique?: Technique;
  container?: ContainerInput;
  recentlyCollected?: boolean;
  weak: boolean;
  tropics?: boolean;
  /** A double-flush pine whose candles are being cut or whose second flush is extending. */
  secondFlush?: boolean;
}

/** Slow species that need little feeding: five-needle pines and low-vigour species. */
export function isLightFeeder(species: WizardSpecies, technique?: Technique): boolean {
  return technique === 'pine-five' || species.needlesPerFascicle === 5 || species.vigour === 'low';
}

export function feedingPlan(f: FeedingInput): FertilizerPlan {
  const reasons: Reason[] = [];
  const light = isLightFeeder(f.species, f.technique);
  const collected = f.stage === 'recovery' && !!f.recentlyCollected;

  let regime: Regime | null;
  let purpose: string;
  if (collected) {
    regime = null;
    reasons.push(reason('feed.purpose-recovery-collected'));
    purpose = 'New roots first: no pellets until new roots and new shoots show, then very light feeding.';
  } else if (f.stage === 'recovery') {
    regime = 'light';
    reasons.push(reason('feed.purpose-recovery-weak'));
    purpose = 'Rebuild strength gently with light, steady feeding.';
  } else if (f.stage === 'refinement') {
    regime = light ? 'light' : 'moderate';
    reasons.push(reason('feed.purpose-refinement'), reason('feed.refinement-pellets'), reason('feed.not-heavy-in-refinement'));
    purpose = 'Steady strength for new buds, without coarse growth.';
  } else {
    regime = light ? 'moderate' : 'heavy';
    reasons.push(reason('feed.purpose-development'), reason('feed.development-pellets'));
    purpose = 'Vigour: build the foliage that sets back buds.';
  }
  if (light && !collected) reasons.push(reason('feed.light-feeder'));
  const holdBack = f.stage === 'refinement' && f.species.feedingNeedleResponse === 'strong';
  if (holdBack) reasons.push(reason('feed.hold-back-strong-needle-response'));
  if (f.secondFlush) reasons.push(reason('feed.ease-second-flush'));
  if (regime) reasons.push(reason('feed.why-organic'));

  let surfaceCm2: number | null = null;
  let piles: number | null = null;
  let pellets: { min: number; max: number } | null = regime ? { ...PELLETS[regime] } : null;
  if (f.container) surfaceCm2 = Math.round(surfaceAreaCm2(f.container));
  if (regime && surfaceCm2 !== null) {
    const fit = pilesForSurface(surfaceCm2, regime);
    piles = fit.piles;
    pellets = fit.pellets;
    reasons.push(
      reason(
        'feed.pile-scaling',
        `Your ${describeContainer(f.container!)} has about ${surfaceCm2} cm² of soil: ${piles} ${piles === 1 ? 'pile' : 'piles'} of ${pellets.min}–${pellets.max} pellets.`,
      ),
    );
  } else if (regime) {
    reasons.push(reason('feed.mid-sized-pot'));
  }
  if (regime) reasons.push(reason('feed.renew'));

  let feedNow = true;
  let resumeWhen: string | null = null;
  let window = f.stage === 'recovery' ? 'Spring through autumn, lightly and steadily' : 'Spring through autumn';
  if (holdBack) window = 'From when this year’s needles have hardened until the end of autumn';
  if (f.secondFlush) window = 'Spring until the candles are cut; again once the second flush has hardened, until the end of autumn';
  if (collected) {
    feedNow = false;
    window = 'Once new roots and new shoots show: very light feeding';
    resumeWhen = 'Start very light feeding once new roots show at the drainage holes and new shoots are growing.';
  } else if (f.season === 'winter' && !f.tropics) {
    feedNow = false;
    reasons.push(reason('feed.winter-none'));
    resumeWhen = 'Start feeding again when the buds swell in spring.';
  } else if (f.secondFlush) {
    feedNow = false;
    resumeWhen = 'Start feeding again once the second flush’s needles have hardened.';
  } else if (holdBack && f.shoot !== 'needles-hardened') {
    feedNow = false;
    resumeWhen = 'Start feeding once this year’s needles have hardened.';
  }

  const count = piles ?? (regime ? REFERENCE_PILES[regime] : 0);
  return {
    feedNow,
    window,
    purpose,
    piles,
    pelletsPerPile: pellets,
    foliar: f.stage === 'development' && !light,
    placement: regime
      ? `${piles === null ? `About ${count}` : count} ${count === 1 ? 'pile' : 'piles'} of ${pellets!.min}–${pellets!.max} pellets, spaced evenly around the pot, halfway between trunk and rim.`
      : 'No pellets yet.',
    surfaceCm2,
    pelletSize: PELLET_SIZE,
    renewWeeks: regime ? { ...RENEW_WEEKS } : null,
    resumeWhen,
    reasons,
  };
}

// Liquid feed: ppm of N, P and K from grams per litre and the label analysis.
// 1 ppm = 1 mg/L, so ppm = g/L × percent × 10. Labels give phosphorus as P₂O₅ and potassium as K₂O.
export const P2O5_TO_P = 0.43643; // from atomic masses P 30.973762, O 15.999
export const K2O_TO_K = 0.83015; // from atomic masses K 39.0983, O 15.999

export interface LabelAnalysis {
  /** Percent N, P₂O₅, K₂O as printed on the label (e.g. 20-20-20). */
  n: number;
  p2o5: number;
  k2o: number;
}

export function liquidFeedPpm(gramsPerLitre: number, label: LabelAnalysis): { n: number; p: number; k: number } {
  const ppm = (pct: number) => gramsPerLitre * pct * 10;
  return { n: ppm(label.n), p: ppm(label.p2o5 * P2O5_TO_P), k: ppm(label.k2o * K2O_TO_K) };
}

/** The grams per litre that give a target ppm of nitrogen. */
export function gramsPerLitreForN(targetPpmN: number, nPercent: number): number {
  if (nPercent <= 0) throw new RangeError('The label must contain nitrogen.');
  return targetPpmN / (nPercent * 10);
}

/** US units: ounces per 100 US gallons as grams per litre (28.349523 g per oz, 378.54118 L per 100 gal). */
export function ozPer100GalToGramsPerLitre(oz: number): number {
  return (oz * 28.349523125) / 378.541178;
}
