import type { WizardSpecies } from '@/lib/validation/species';
import { evaluate } from './engine';
import { parseIsoDate, seasonOf, type SeasonInfo } from './season';
import type { Action, Hemisphere, Season, ShootState, Stage } from './types';

/** The shoot state a healthy pine usually shows at a point of the season. */
export function typicalShootState(s: SeasonInfo): ShootState {
  if (s.season === 'winter') return 'dormant-bud';
  if (s.season === 'spring') return s.monthOfSeason === 1 ? 'dormant-bud' : s.monthOfSeason === 2 ? 'candle-extending' : 'needles-opening';
  return 'needles-hardened';
}

export interface DueNowInput {
  species: WizardSpecies;
  /** What the grower knows of the tree's stage; refinement when unknown. */
  stageHint?: Stage;
  /** Same as stageHint (either name is accepted). */
  stage?: Stage;
  date: string;
  hemisphere: Hemisphere;
}

export interface DueNow {
  season: Season;
  stage: Stage;
  assumedShoot: ShootState;
  action: Action;
  headline: string;
  feedNow: boolean;
  feedingWindow: string;
  watch: string[];
  rules: string[];
}

/**
 * What is due now on a tree, by running the engine itself on the shoot state typical of the
 * date (an outer shoot of a strong tree). The wizard, asked about a real shoot, is the authority.
 */
export function dueNow(input: DueNowInput): DueNow {
  const date = parseIsoDate(input.date);
  if (!date) throw new RangeError('date must be YYYY-MM-DD');
  const s = seasonOf(date, input.hemisphere);
  const stage = input.stageHint ?? input.stage ?? 'refinement';
  const shoot = typicalShootState(s);
  const result = evaluate(
    {
      species: input.species.slug,
      branching: stage === 'refinement' ? 'tertiary' : 'secondary',
      date: input.date,
      hemisphere: input.hemisphere,
      shoot,
      position: 'beyond-silhouette',
      health: stage === 'recovery' ? 'weak' : 'strong',
      backBuds: stage === 'development' ? true : undefined,
    },
    input.species,
    { hemisphere: input.hemisphere, latitude: input.hemisphere === 'south' ? -45 : 45, today: input.date },
  );
  return {
    season: result.season,
    stage: result.stage,
    assumedShoot: shoot,
    action: result.action,
    headline: result.headline,
    feedNow: result.fertilizer.feedNow,
    feedingWindow: result.fertilizer.window,
    watch: result.watch,
    rules: result.reasons.map((r) => r.rule),
  };
}
