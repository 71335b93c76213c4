import { z } from 'zod';

// The species record: the front matter of content/species/*.md, the `data` of a species
// revision, and the body of POST/PATCH /api/species. One schema for all three.

export const provenanceKinds = ['published', 'common-practice', 'from-memory'] as const;
export type ProvenanceKind = (typeof provenanceKinds)[number];

export const speciesGroups = ['pine', 'larch', 'spruce', 'fir', 'cedar', 'juniper', 'cypress', 'yew', 'other'] as const;
export const flushHabits = ['single', 'double'] as const;
export const shootHabits = ['uninodal', 'multinodal', 'not-applicable'] as const;
export const levels = ['low', 'moderate', 'high'] as const;
export const needleResponses = ['slight', 'moderate', 'strong'] as const;

/** A trait value with where it came from. `published` needs a citation. */
export function trait<T extends z.ZodType>(value: T) {
  return z
    .object({
      value,
      provenance: z.enum(provenanceKinds, { error: 'Say where this value comes from: published, common-practice or from-memory.' }),
      citation: z.string().trim().max(400).optional(),
      note: z.string().trim().max(400).optional(),
    })
    .refine((t) => t.provenance !== 'published' || !!t.citation, {
      error: 'A published value needs its citation.',
      path: ['citation'],
    });
}

export const slugSchema = z
  .string()
  .trim()
  .min(3)
  .max(80)
  .regex(/^[a-z]+(-[a-z]+)+$/, { error: 'Use the botanical name in kebab case, e.g. pinus-sylvestris.' });

export const mmRange = z
  .object({ min: z.number().positive().max(500), max: z.number().positive().max(500) })
  .refine((r) => r.min <= r.max, { error: 'The minimum must not exceed the maximum.', path: ['max'] });

export const zoneRange = z
  .object({ min: z.number().int().min(1).max(13), max: z.number().int().min(1).max(13) })
  .refine((r) => r.min <= r.max, { error: 'The minimum zone must not exceed the maximum.', path: ['max'] });

export const speciesTraitsSchema = z.object({
  flushHabit: trait(z.enum(flushHabits)),
  shootHabit: trait(z.enum(shootHabits)),
  needlesPerFascicle: trait(z.number().int().min(1).max(8).nullable()),
  needleLengthMm: trait(mmRange),
  vigour: trait(z.enum(levels)),
  backBudding: trait(z.enum(levels)),
  feedingNeedleResponse: trait(z.enum(needleResponses)),
  hardinessZones: trait(zoneRange.nullable()),
  nativeRange: trait(z.string().trim().min(1).max(600)),
});

export const cautionSchema = z.object({
  text: z.string().trim().min(1).max(600),
  provenance: z.enum(provenanceKinds),
  citation: z.string().trim().max(400).optional(),
});

export const speciesRecordSchema = z.object({
  slug: slugSchema,
  botanicalName: z.string().trim().min(3).max(120),
  commonNames: z.array(z.string().trim().min(1).max(80)).min(1, { error: 'Give at least one common name.' }).max(20),
  synonyms: z.array(z.string().trim().min(1).max(80)).max(30).default([]),
  genus: z.string().trim().min(2).max(60),
  group: z.enum(speciesGroups),
  traits: speciesTraitsSchema,
  cautions: z.array(cautionSchema).max(20).default([]),
});

export type SpeciesRecord = z.infer<typeof speciesRecordSchema>;
export type SpeciesTraits = SpeciesRecord['traits'];

/** What the wizard engine needs of a species (pure data, no provenance). */
export interface WizardSpecies {
  slug: string;
  botanicalName: string;
  commonName: string;
  group: SpeciesRecord['group'];
  revision: number;
  flushHabit: (typeof flushHabits)[number];
  shootHabit: (typeof shootHabits)[number];
  needleLengthMm: { min: number; max: number };
  vigour: (typeof levels)[number];
  backBudding: (typeof levels)[number];
  feedingNeedleResponse: (typeof needleResponses)[number];
  cautions: { text: string; source: string }[];
}

export function sourceLabel(t: { provenance: ProvenanceKind; citation?: string }): string {
  if (t.provenance === 'published') return t.citation ?? 'published';
  return t.provenance === 'common-practice' ? 'common practice' : 'from memory';
}

export function toWizardSpecies(rec: SpeciesRecord, revision: number): WizardSpecies {
  const t = rec.traits;
  return {
    slug: rec.slug,
    botanicalName: rec.botanicalName,
    commonName: rec.commonNames[0],
    group: rec.group,
    revision,
    flushHabit: t.flushHabit.value,
    shootHabit: t.shootHabit.value,
    needleLengthMm: t.needleLengthMm.value,
    vigour: t.vigour.value,
    backBudding: t.backBudding.value,
    feedingNeedleResponse: t.feedingNeedleResponse.value,
    cautions: rec.cautions.map((c) => ({ text: c.text, source: sourceLabel(c) })),
  };
}
