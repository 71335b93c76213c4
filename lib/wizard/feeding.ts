import type { WizardSpecies } from '@/lib/validation/species';
import { describeContainer, surfaceAreaCm2 } from './container';
import { reason } from './rules';
import type { ContainerInput, FertilizerPlan, Reason, Season, ShootState, Stage } from './types';

/** The pot the pile counts are calibrated on: about 1 200 cm² of soil (40 × 30 cm). */
export const REFERENCE_SURFACE_CM2 = 1200;
export const REFERENCE_PILES = { refinement: 4, development: 8 } as const;

export const PELLETS = {
  moderate: { min: 6, max: 8 },
  heavy: { min: 10, max: 12 },
} as const;

/**
 * Piles for a soil surface: linear in the area, calibrated on the reference pot, at least one
 * (two in heavy feeding, which always has about twice the moderate count). Our own rule.
 */
export function pilesForSurface(surfaceCm2: number, regime: 'moderate' | 'heavy'): number {
  const base = regime === 'heavy' ? REFERENCE_PILES.development : REFERENCE_PILES.refinement;
  const n = Math.round((base * surfaceCm2) / REFERENCE_SURFACE_CM2);
  return Math.max(regime === 'heavy' ? 2 : 1, n);
}

export interface FeedingInput {
  stage: Stage;
  season: Season;
  shoot: ShootState;
  species: WizardSpecies;
  container?: ContainerInput;
  recentlyCollected?: boolean;
  weak: boolean;
}

export function feedingPlan(f: FeedingInput): FertilizerPlan {
  const reasons: Reason[] = [];
  // A collected tree that is not weak is fed generously to build roots; a weak tree moderately.
  const regime: 'moderate' | 'heavy' =
    f.stage === 'development' || (f.stage === 'recovery' && f.recentlyCollected && !f.weak) ? 'heavy' : 'moderate';
  const holdBack = f.stage === 'refinement' && f.species.feedingNeedleResponse === 'strong';

  let purpose: string;
  if (f.stage === 'refinement') {
    reasons.push(reason('feed.purpose-refinement'), reason('feed.refinement-pellets'), reason('feed.not-heavy-in-refinement'));
    purpose = 'Give the candles strength to redistribute after pinching, without coarse growth.';
  } else if (f.stage === 'development') {
    reasons.push(reason('feed.purpose-development'), reason('feed.development-pellets'));
    purpose = 'Vigour: build the foliage that sets back buds.';
  } else {
    reasons.push(reason('feed.purpose-recovery'));
    purpose = 'Rebuild roots and strength.';
  }
  if (holdBack) reasons.push(reason('feed.hold-back-strong-needle-response'));
  reasons.push(reason('feed.why-organic'));

  let surfaceCm2: number | null = null;
  let piles: number | null = null;
  if (f.container) {
    surfaceCm2 = Math.round(surfaceAreaCm2(f.container));
    piles = pilesForSurface(surfaceCm2, regime);
    reasons.push(reason('feed.pile-scaling', `Your ${describeContainer(f.container)} has about ${surfaceCm2} cm² of soil: ${piles} piles.`));
  } else {
    reasons.push(reason('feed.mid-sized-pot'));
  }

  let feedNow = true;
  let window = f.stage === 'recovery' ? 'Spring through autumn, steadily' : 'Spring through autumn';
  if (holdBack) window = 'From when this year’s needles have hardened until the end of autumn';
  if (f.season === 'winter') {
    feedNow = false;
    reasons.push(reason('feed.winter-none'));
  } else if (holdBack && f.season === 'spring' && f.shoot !== 'needles-hardened') {
    feedNow = false;
  }

  const pellets = regime === 'heavy' ? PELLETS.heavy : PELLETS.moderate;
  const count = piles ?? (regime === 'heavy' ? REFERENCE_PILES.development : REFERENCE_PILES.refinement);
  return {
    feedNow,
    window,
    purpose,
    piles,
    pelletsPerPile: { ...pellets },
    foliar: f.stage === 'development',
    placement: `${piles === null ? `About ${count}` : count} piles of ${pellets.min}–${pellets.max} pellets, spaced evenly around the pot, halfway between trunk and rim.`,
    surfaceCm2,
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
