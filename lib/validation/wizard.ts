import { z } from 'zod';
import { branchingLevels, candleStrengths, containerShapes, hemispheres, healthLevels, positions, shootStates, actions } from '@/lib/wizard/types';
import { parseIsoDate } from '@/lib/wizard/season';
import { slugSchema } from './species';
import { boundedIsoDate } from './bounds';
import { potDimensionSchema } from './container';

export const containerSchema = z
  .object({
    shape: z.enum(containerShapes),
    lengthCm: potDimensionSchema,
    widthCm: potDimensionSchema.optional(),
  })
  .refine((c) => c.shape === 'round' || c.widthCm !== undefined, {
    error: 'A rectangular or oval pot needs its width.',
    path: ['widthCm'],
  });

const latitudeSchema = z
  .number({ error: 'Give the latitude in degrees.' })
  .min(-90, { error: 'A latitude is from -90 to 90 degrees.' })
  .max(90, { error: 'A latitude is from -90 to 90 degrees.' });

// The same years as every other date in the record (a tree's, a note's), and a real calendar day.
const isoDateSchema = boundedIsoDate('Give a real date as YYYY-MM-DD.').refine((s) => parseIsoDate(s) !== null, {
  error: 'Give a real date as YYYY-MM-DD.',
});

export const evaluateBodySchema = z
  .object({
    species: slugSchema,
    // Not asked for a recovering tree (weak or recently collected): its answer does not depend on it.
    branching: z.enum(branchingLevels).optional(),
    date: isoDateSchema,
    hemisphere: z.enum(hemispheres).optional(),
    latitude: latitudeSchema.optional(),
    shoot: z.enum(shootStates),
    position: z.enum(positions).optional(),
    health: z.enum(healthLevels),
    recentlyCollected: z.boolean().optional(),
    backBuds: z.boolean().optional(),
    container: containerSchema.optional(),
    candleStrength: z.enum(candleStrengths).optional(),
    repottedThisYear: z.boolean().optional(),
    // °C days above +5 °C since the season began; a year rarely passes 6 000 even in the tropics.
    degreeDays: z.number().min(0).max(10_000).optional(),
  })
  .refine((b) => b.branching !== undefined || isRecovering(b), {
    error: 'Say how far the branching is.',
    path: ['branching'],
  })
  // Position against the silhouette decides refinement; development does not ask it.
  .refine((b) => b.branching !== 'tertiary' || b.position !== undefined, {
    error: 'Say where the shoot is against the silhouette.',
    path: ['position'],
  })
  // A hemisphere and a latitude that disagree are refused, never silently flipped.
  .superRefine((b, ctx) => {
    if (!b.hemisphere || b.latitude === undefined || b.latitude === 0) return;
    if (b.latitude < 0 === (b.hemisphere === 'south')) return;
    const message = `The ${b.hemisphere}ern hemisphere and latitude ${b.latitude}° disagree: southern latitudes are negative.`;
    ctx.addIssue({ code: 'custom', path: ['hemisphere'], message });
    ctx.addIssue({ code: 'custom', path: ['latitude'], message });
  });

export type EvaluateBody = z.infer<typeof evaluateBodySchema>;

/** A weak or recently collected tree is in recovery whatever its branching: the wizard asks no more about shape. */
export function isRecovering(a: { health?: string; recentlyCollected?: boolean }): boolean {
  return a.health === 'weak' || a.recentlyCollected === true;
}

const visibilities = ['private', 'club'] as const;

export const saveAnswerSchema = z.intersection(
  evaluateBodySchema,
  z.object({
    treeId: z.string().trim().min(1).max(64).optional(),
    note: z.string().trim().max(2000).optional(),
    visibility: z.enum(visibilities).optional(),
  }),
);

export const patchAnswerSchema = z
  .object({
    followUp: z.string().trim().max(4000).optional(),
    note: z.string().trim().max(2000).optional(),
    visibility: z.enum(visibilities).optional(),
    /** Attach the answer to one of your trees later, or detach it (null). */
    treeId: z.string().trim().min(1).max(64).nullable().optional(),
  })
  .strict()
  .refine((p) => Object.keys(p).length > 0, { error: 'Change at least one of followUp, note, visibility, treeId.' });

export const listAnswersQuerySchema = z.object({
  cursor: z.string().max(200).optional(),
  species: slugSchema.optional(),
  action: z.enum(actions).optional(),
  limit: z.coerce.number().int().min(1).max(100).optional(),
  /** `mine` (default): your own answers; `club`: everyone's answers shared with the club. */
  scope: z.enum(['mine', 'club']).optional(),
});
