// The wizard's vocabulary: what a grower tells us and what the engine answers.
// Shared by the engine, the machine, the API schema and the answer log.

export const branchingLevels = ['primary', 'secondary', 'tertiary'] as const;
export const shootStates = ['dormant-bud', 'candle-extending', 'needles-opening', 'needles-hardened'] as const;
export const positions = ['beyond-silhouette', 'at-silhouette', 'interior'] as const;
export const healthLevels = ['strong', 'average', 'weak'] as const;
export const hemispheres = ['north', 'south'] as const;
export const containerShapes = ['round', 'rectangle', 'oval'] as const;
export const actions = ['pinch', 'prune', 'let-grow', 'decandle', 'thin', 'wait'] as const;
export const candleStrengths = ['strong', 'average', 'weak'] as const;
export const stages = ['development', 'refinement', 'recovery'] as const;
export const seasons = ['winter', 'spring', 'summer', 'autumn'] as const;

export type Branching = (typeof branchingLevels)[number];
export type ShootState = (typeof shootStates)[number];
export type Position = (typeof positions)[number];
export type Health = (typeof healthLevels)[number];
export type Hemisphere = (typeof hemispheres)[number];
export type ContainerShape = (typeof containerShapes)[number];
export type Action = (typeof actions)[number];
export type Stage = (typeof stages)[number];
export type Season = (typeof seasons)[number];
export type CandleStrength = (typeof candleStrengths)[number];

export interface ContainerInput {
  shape: ContainerShape;
  /** Diameter for a round pot; the long side (or long axis) otherwise. */
  lengthCm: number;
  widthCm?: number;
}

export interface WizardInput {
  species: string;
  /** Not asked in recovery (weak or recently collected), where it changes nothing. */
  branching?: Branching;
  /** ISO date of the observation; the context's "today" when absent. */
  date?: string;
  hemisphere?: Hemisphere;
  latitude?: number;
  shoot: ShootState;
  /** Only asked in refinement; development ignores it. */
  position?: Position;
  health: Health;
  recentlyCollected?: boolean;
  backBuds?: boolean;
  container?: ContainerInput;
  /** This candle against the others on the tree. */
  candleStrength?: CandleStrength;
  /** A tree repotted this year is not decandled. */
  repottedThisYear?: boolean;
  /** Heat sum (°C days above +5 °C) since the start of this year's season, where a record supplies it. */
  degreeDays?: number;
}

export interface WizardContext {
  /** The club setting, used when the input names neither hemisphere nor latitude. */
  hemisphere: Hemisphere;
  latitude: number;
  /** ISO date. */
  today: string;
  /** The club's shift of the decandle window, in days (−30 to +30); 0 when unset. */
  decandleOffsetDays?: number;
}

export interface Reason {
  rule: string;
  text: string;
  source: string;
}

export interface Term {
  term: string;
  definition: string;
}

export interface Caution {
  text: string;
  source: string;
}

export interface FertilizerPlan {
  feedNow: boolean;
  window: string;
  purpose: string;
  piles: number | null;
  pelletsPerPile: { min: number; max: number } | null;
  foliar: boolean;
  placement: string;
  /** Soil surface in cm² when a container was given. */
  surfaceCm2: number | null;
  /** How big a pellet is meant, in words. */
  pelletSize: string;
  /** How often piles are renewed, in weeks, when pellets are used. */
  renewWeeks: { min: number; max: number } | null;
  /** When feeding is off: what to wait for before starting again. */
  resumeWhen: string | null;
  reasons: Reason[];
}

export interface DayLength {
  hours: number;
  /** The latitude actually used (sign follows the hemisphere). */
  latitude: number;
  text: string;
}

export interface WizardResult {
  action: Action;
  stage: Stage;
  season: Season;
  keepNeedlePairs: number | null;
  /** The fraction (0–1) of this candle's length to leave when pinching or shortening. */
  candleKeep: { min: number; max: number } | null;
  /** Needle bundles to leave below a cut on a hardened shoot. */
  keepNeedleBundles: number | null;
  /** The steps of doing the action. */
  howTo: string[];
  /** Every trade term the answer uses, explained. */
  terms: Term[];
  reasons: Reason[];
  cautions: Caution[];
  fertilizer: FertilizerPlan;
  engineVersion: string;
  speciesRevision: number;
  // Beyond the fixed contract: what the answer screen also shows.
  headline: string;
  watch: string[];
  hemisphere: Hemisphere;
  dayLength: DayLength;
  date: string;
  speciesSlug: string;
  speciesName: string;
}
