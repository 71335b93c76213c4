import type { WizardSpecies } from '@/lib/validation/species';
import { evaluate, shootLabels } from './engine';
import { parseIsoDate, seasonOf, type SeasonInfo } from './season';
import type { Hemisphere, Season, ShootState, Stage } from './types';

/**
 * The shoot states a pine may show at this point of the season, earliest first. Nothing here is
 * an observation: the tree page uses it to say what to look for, never what to do.
 */
function likelyShootStates(s: SeasonInfo): ShootState[] {
  if (s.season === 'winter') return ['dormant-bud'];
  if (s.season === 'spring') {
    if (s.monthOfSeason === 1) return ['dormant-bud', 'candle-extending'];
    if (s.monthOfSeason === 2) return ['candle-extending', 'needles-opening'];
    return ['candle-extending', 'needles-opening', 'needles-hardened'];
  }
  if (s.season === 'summer' && s.monthOfSeason === 1) return ['needles-opening', 'needles-hardened'];
  return ['needles-hardened'];
}

export interface DueNowInput {
  species: WizardSpecies;
  /** What the grower knows of the tree's stage; refinement when unknown. */
  stageHint?: Stage;
  /** Same as stageHint (either name is accepted). */
  stage?: Stage;
  date: string;
  hemisphere: Hemisphere;
  latitude?: number;
}

interface LookFor {
  shoot: ShootState;
  /** The shoot state in words. */
  label: string;
  /** What the wizard would answer for an outer shoot in that state: conditional on seeing it. */
  ifSeen: string;
}

export interface DueNow {
  season: Season;
  stage: Stage;
  /** "Look for: …" — what to check on the tree this month. Never an action. */
  headline: string;
  lookFor: LookFor[];
  feedingWindow: string;
}

/**
 * What to look for on a tree this month. The engine is asked about each shoot state the season
 * makes likely, so the page can say "if you see candles extending, …", but nothing is presented
 * as due until a member observes the shoot (in the wizard).
 */
export function dueNow(input: DueNowInput): DueNow {
  const date = parseIsoDate(input.date);
  if (!date) throw new RangeError('date must be YYYY-MM-DD');
  const s = seasonOf(date, input.hemisphere);
  const stage = input.stageHint ?? input.stage ?? 'refinement';
  const latitude = input.latitude ?? (input.hemisphere === 'south' ? -45 : 45);
  const lookFor = likelyShootStates(s).map((shoot) => {
    const r = evaluate(
      {
        species: input.species.slug,
        branching: stage === 'refinement' ? 'tertiary' : 'secondary',
        date: input.date,
        hemisphere: input.hemisphere,
        shoot,
        position: 'beyond-silhouette',
        health: stage === 'recovery' ? 'weak' : 'average',
      },
      input.species,
      { hemisphere: input.hemisphere, latitude, today: input.date },
    );
    return { shoot, label: shootLabels[shoot], ifSeen: r.headline, feeding: r.fertilizer.window };
  });
  return {
    season: s.season,
    stage,
    headline: `Look for: ${lookFor.map((l) => l.label).join(' or ')}`,
    lookFor: lookFor.map(({ shoot, label, ifSeen }) => ({ shoot, label, ifSeen })),
    feedingWindow: lookFor[0].feeding,
  };
}
