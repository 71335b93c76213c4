import type { WizardSpecies } from '@/lib/validation/species';
import type { WizardContext, WizardInput } from '@/lib/wizard/types';

// Fixture species for the engine tests: the traits the rules read, nothing else.
export const scots: WizardSpecies = {
  slug: 'pinus-sylvestris',
  botanicalName: 'Pinus sylvestris',
  commonName: 'Scots pine',
  group: 'pine',
  revision: 3,
  flushHabit: 'single',
  shootHabit: 'uninodal',
  needlesPerFascicle: 2,
  needleLengthMm: { min: 30, max: 70 },
  vigour: 'moderate',
  backBudding: 'moderate',
  feedingNeedleResponse: 'moderate',
  cautions: [],
};
export const mugo: WizardSpecies = {
  ...scots,
  slug: 'pinus-mugo',
  botanicalName: 'Pinus mugo',
  commonName: 'Mountain pine',
  revision: 1,
  vigour: 'high',
  feedingNeedleResponse: 'strong',
  cautions: [{ text: 'Invasive where planted out in some regions: do not plant it out there.', source: 'from memory' }],
};
export const blackPine: WizardSpecies = {
  ...scots,
  slug: 'pinus-thunbergii',
  botanicalName: 'Pinus thunbergii',
  commonName: 'Japanese black pine',
  revision: 2,
  flushHabit: 'double',
  vigour: 'high',
  needleLengthMm: { min: 60, max: 120 },
};

export const north: WizardContext = { hemisphere: 'north', latitude: 45, today: '2027-05-10' };

export function ask(over: Partial<WizardInput> = {}): WizardInput {
  return {
    species: 'pinus-sylvestris',
    branching: 'tertiary',
    date: '2027-05-10',
    shoot: 'candle-extending',
    position: 'beyond-silhouette',
    health: 'average',
    ...over,
  };
}
