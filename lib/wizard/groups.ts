import type { WizardSpecies } from '@/lib/validation/species';

// How the wizard works a species: by technique group, derived from the species' group and its
// traits, never from the flush habit alone.
export type Technique =
  | 'pine-single' // single-flush pines with one whorl a year (uninodal)
  | 'pine-multinodal' // pines with several whorls along one year's shoot, or several flushes a season
  | 'pine-double' // pines that push a second flush after their spring candles are cut
  | 'pine-five' // five-needle pines: slow, reduced lightly
  | 'scale-foliage' // junipers, cypresses, Cryptomeria and swamp cypress
  | 'spruce' // spruce, Douglas fir, hemlock: buds along the shoot, cut to a side bud
  | 'fir'
  | 'larch' // deciduous: no needles to count
  | 'yew' // yews and podocarps: regrow from old wood
  | 'cedar'
  | 'unknown';

export function techniqueOf(species: Pick<WizardSpecies, 'group' | 'flushHabit' | 'shootHabit' | 'needlesPerFascicle'>): Technique {
  switch (species.group) {
    case 'pine':
      if (species.needlesPerFascicle === 5) return 'pine-five';
      if (species.flushHabit === 'double') return 'pine-double';
      if (species.flushHabit === 'polycyclic' || species.shootHabit === 'multinodal') return 'pine-multinodal';
      return 'pine-single';
    case 'juniper':
    case 'cypress':
    case 'redwood':
      return 'scale-foliage';
    case 'spruce':
    case 'douglas-fir':
    case 'hemlock':
      return 'spruce';
    case 'fir':
      return 'fir';
    case 'larch':
      return 'larch';
    case 'yew':
    case 'podocarp':
      return 'yew';
    case 'cedar':
      return 'cedar';
    default:
      return 'unknown';
  }
}

export const isPine = (t: Technique) => t.startsWith('pine-');

/** "needle pair" for two-needle pines, "bundle of three needles" and so on; null off the pines. */
export function bundleWord(needles: number | null, plural: boolean): string | null {
  if (needles === null) return null;
  if (needles === 2) return plural ? 'needle pairs' : 'needle pair';
  const n = { 1: 'single', 3: 'three', 4: 'four', 5: 'five' }[needles] ?? String(needles);
  return plural ? `needle bundles (${n} needles each)` : `needle bundle of ${n}`;
}
