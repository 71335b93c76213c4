import type { SpeciesRecord } from '@/lib/validation/species';

/** A starting record for a new species: every trait present, every value marked from memory until sourced. */
export function blankSpecies(): SpeciesRecord {
  const m = { provenance: 'from-memory' as const };
  return {
    slug: '',
    botanicalName: '',
    commonNames: [],
    synonyms: [],
    genus: '',
    group: 'pine',
    traits: {
      flushHabit: { value: 'single', ...m },
      shootHabit: { value: 'uninodal', ...m },
      needlesPerFascicle: { value: 2, ...m },
      needleLengthMm: { value: { min: 30, max: 70 }, ...m },
      vigour: { value: 'moderate', ...m },
      backBudding: { value: 'moderate', ...m },
      feedingNeedleResponse: { value: 'moderate', ...m },
      hardinessZones: { value: null, ...m },
      nativeRange: { value: '', ...m },
    },
    cautions: [],
  };
}
