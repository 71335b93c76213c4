import type { ProvenanceKind, SpeciesTraits } from '@/lib/validation/species';

// Interface wording for species traits, shared by the pages, the form and the diff.

export const traitLabels: Record<keyof SpeciesTraits, string> = {
  flushHabit: 'Flush habit (trade)',
  shootHabit: 'Natural shoot habit (botany)',
  needlesPerFascicle: 'Needles per bundle',
  needleLengthMm: 'Natural needle length',
  vigour: 'Vigour',
  backBudding: 'Readiness to back-bud',
  feedingNeedleResponse: 'Needle lengthening with feeding',
  hardinessZones: 'Hardiness (USDA zones)',
  nativeRange: 'Native range',
};

export const traitOrder = Object.keys(traitLabels) as (keyof SpeciesTraits)[];

export const groupLabels: Record<string, string> = {
  pine: 'Pine',
  larch: 'Larch',
  spruce: 'Spruce',
  fir: 'Fir',
  'douglas-fir': 'Douglas fir',
  hemlock: 'Hemlock',
  cedar: 'Cedar',
  juniper: 'Juniper',
  cypress: 'Cypress',
  redwood: 'Cryptomeria and swamp cypress',
  yew: 'Yew',
  podocarp: 'Podocarp',
  other: 'Other',
};

export const valueLabels: Record<string, string> = {
  single: 'Single flush',
  double: 'Double flush',
  polycyclic: 'Several flushes a season (polycyclic)',
  uninodal: 'Uninodal',
  multinodal: 'Multinodal',
  'not-applicable': 'Not applicable',
  low: 'Low',
  moderate: 'Moderate',
  high: 'High',
  slight: 'Slight',
  strong: 'Strong',
};

export const provenanceLabels: Record<ProvenanceKind, { short: string; option: string; long: string }> = {
  published: { short: 'P', option: 'Published', long: 'Published source' },
  'common-practice': { short: 'C', option: 'Common practice', long: 'Common practice (trade knowledge, no published source)' },
  'from-memory': { short: 'M', option: 'From memory', long: 'From memory (not yet checked against a source)' },
};

/** A trait value as text. */
export function formatTraitValue(key: keyof SpeciesTraits, value: unknown): string {
  if (value === null || value === undefined) return key === 'needlesPerFascicle' ? 'Not in bundles' : 'Not known';
  if (key === 'needleLengthMm' || key === 'hardinessZones') {
    const r = value as { min: number; max: number };
    const unit = key === 'needleLengthMm' ? ' mm' : '';
    return r.min === r.max ? `${r.min}${unit}` : `${r.min}–${r.max}${unit}`;
  }
  if (typeof value === 'string') return valueLabels[value] ?? value;
  return String(value);
}
