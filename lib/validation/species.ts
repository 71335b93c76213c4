import { z } from 'zod';
import { INT4_MAX, positiveInt4 } from './bounds';
import { markdownProblem } from '@/lib/markdown/limits';

// The species record: the front matter of content/species/*.md, the `data` of a species
// revision, and the body of POST/PATCH /api/species. One schema for all three.

export const provenanceKinds = ['published', 'common-practice', 'from-memory'] as const;
export type ProvenanceKind = (typeof provenanceKinds)[number];

// The groups the wizard models techniques for. `redwood` holds Cryptomeria and Taxodium (awl or
// linear foliage on green shoots), `podocarp` the southern yews.
export const speciesGroups = [
  'pine',
  'larch',
  'spruce',
  'fir',
  'douglas-fir',
  'hemlock',
  'cedar',
  'juniper',
  'cypress',
  'redwood',
  'yew',
  'podocarp',
  'other',
] as const;
// The trade trait: one flush a season, a second flush after the spring candles are cut, or several
// growth units in one season on their own (polycyclic). The botanical shoot habit sits beside it.
export const flushHabits = ['single', 'double', 'polycyclic'] as const;
export type FlushHabit = (typeof flushHabits)[number];
export const shootHabits = ['uninodal', 'multinodal', 'not-applicable'] as const;
export const levels = ['low', 'moderate', 'high'] as const;
export const needleResponses = ['slight', 'moderate', 'strong'] as const;

/**
 * A trait value with where it came from. A draft may hold a `published` value whose citation is
 * still to be found; publishing checks `missingCitations` (the editorial write and the species files).
 */
function trait<T extends z.ZodType>(value: T) {
  return z.object({
    value,
    provenance: z.enum(provenanceKinds, { error: 'Say where this value comes from: published, common-practice or from-memory.' }),
    citation: z.string().trim().max(400).optional(),
    note: z.string().trim().max(400).optional(),
  });
}

const CITATION_NEEDED = 'A published value needs its citation before the species is published.';

/** Field paths (`traits.<name>.citation`) of published values that have no citation yet. */
export function missingCitations(rec: { traits: Record<string, { provenance: ProvenanceKind; citation?: string }> }): Record<string, string[]> {
  const out: Record<string, string[]> = {};
  for (const [k, t] of Object.entries(rec.traits)) {
    if (t.provenance === 'published' && !t.citation?.trim()) out[`traits.${k}.citation`] = [CITATION_NEEDED];
  }
  return out;
}

export const slugSchema = z
  .string()
  .trim()
  .min(3)
  .max(80)
  .regex(/^[a-z]+(-[a-z]+)+$/, { error: 'Use the botanical name in kebab case, e.g. pinus-sylvestris.' });

export const mmRange = z
  // At least 0.1 mm: stored as PostgreSQL reals, which refuse tiny magnitudes like 1e-320.
  .object({ min: z.number().min(0.1).max(500), max: z.number().min(0.1).max(500) })
  .refine((r) => r.min <= r.max, { error: 'The minimum must not exceed the maximum.', path: ['max'] });

const zoneRange = z
  .object({ min: z.number().int().min(1).max(13), max: z.number().int().min(1).max(13) })
  .refine((r) => r.min <= r.max, { error: 'The minimum zone must not exceed the maximum.', path: ['max'] });

const speciesTraitsSchema = z.object({
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

const cautionSchema = z.object({
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
  /** Needles per bundle (fascicle) for pines; null where needles are not in bundles. */
  needlesPerFascicle: number | null;
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
    needlesPerFascicle: t.needlesPerFascicle.value,
    needleLengthMm: t.needleLengthMm.value,
    vigour: t.vigour.value,
    backBudding: t.backBudding.value,
    feedingNeedleResponse: t.feedingNeedleResponse.value,
    cautions: rec.cautions.map((c) => ({ text: c.text, source: sourceLabel(c) })),
  };
}

// ---- Editorial writes and queries (POST/PATCH bodies, list query, import) ----

const MAX_CARE_NOTES = 40_000;

const careNotes = z
  .string()
  .max(MAX_CARE_NOTES, { error: `Keep the care notes under ${MAX_CARE_NOTES} characters.` })
  .superRefine((s, ctx) => {
    const problem = markdownProblem(s);
    if (problem) ctx.addIssue({ code: 'custom', message: problem });
  })
  .default('');
const editSummary = z.string().trim().max(300, { error: 'Keep the edit summary under 300 characters.' }).default('');

/** POST /api/species: a new species as a draft or published at once. */
export const speciesCreateSchema = z.object({
  record: speciesRecordSchema,
  body: careNotes,
  summary: editSummary,
  publish: z.boolean().default(false),
});
export type SpeciesCreateInput = z.infer<typeof speciesCreateSchema>;

/** PATCH /api/species/[slug]: a new revision on top of `baseRevision` (optimistic concurrency). */
export const speciesPatchSchema = speciesCreateSchema.extend({
  baseRevision: z.number({ error: 'Send the revision you started from as baseRevision.' }).int().min(1).max(INT4_MAX),
});
export type SpeciesPatchInput = z.infer<typeof speciesPatchSchema>;

/** POST /api/species/[slug]/revert: copy an old revision into a new one. */
export const speciesRevertSchema = z.object({
  toRevision: positiveInt4(),
  baseRevision: positiveInt4(),
  summary: editSummary,
  publish: z.boolean().default(true),
});

const optionalEnum = <T extends readonly [string, ...string[]]>(values: T) => z.preprocess((v) => (v === '' ? undefined : v), z.enum(values).optional());
const optionalMm = z.preprocess((v) => (v === '' || v == null ? undefined : v), z.coerce.number().min(0.1).max(500).optional());

/** GET /api/species query. */
export const speciesListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  group: optionalEnum(speciesGroups),
  flush: optionalEnum(flushHabits),
  vigour: optionalEnum(levels),
  needleMin: optionalMm,
  needleMax: optionalMm,
  limit: z.preprocess((v) => (v === '' || v == null ? undefined : v), z.coerce.number().int().min(1).max(100).default(50)),
  cursor: z.string().max(400).optional(),
});
export type SpeciesListQuery = z.infer<typeof speciesListQuerySchema>;

export const MAX_IMPORT_FILES = 50;
export const speciesImportSchema = z.object({
  files: z
    .array(z.object({ name: z.string().trim().min(1).max(200), content: z.string().max(MAX_CARE_NOTES + 20_000) }))
    .min(1, { error: 'Choose at least one .md file.' })
    .max(MAX_IMPORT_FILES, { error: `Import at most ${MAX_IMPORT_FILES} files at a time.` }),
  summary: editSummary,
  publish: z.boolean().default(false),
  /** Write the valid files and leave out the ones with errors (listed back), instead of all or nothing. */
  skipInvalid: z.boolean().default(false),
});
export type SpeciesImportInput = z.infer<typeof speciesImportSchema>;
