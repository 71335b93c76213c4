import { z } from 'zod';
import { boundedIsoDate } from './bounds';
import { idSchema } from '@/lib/ids';
import { potDimensionSchema } from './container';

// A member's tree: one schema for the create/edit form and for POST/PATCH /api/trees.
// Dates are ISO calendar dates (YYYY-MM-DD); dimensions are centimetres of the soil surface.

// The same shapes the wizard asks about, so a tree's pot always fits the wizard.
import { containerShapes, type ContainerShape } from '@/lib/wizard/types';
export { containerShapes, type ContainerShape };

export const containerShapeLabels: Record<ContainerShape, string> = {
  round: 'Round',
  rectangle: 'Rectangular',
  oval: 'Oval',
};

/** Today's date in UTC as YYYY-MM-DD (server and browser agree on it within a day). */
export function todayIso(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

const isoDate = boundedIsoDate('Use a date like 2026-04-12.');
const optionalDate = isoDate.nullable();
const dimension = potDimensionSchema;

export const treeFieldsSchema = z.object({
  name: z.string().trim().min(1, { error: 'Give the tree a name.' }).max(80, { error: 'Keep the name under 80 characters.' }),
  speciesSlug: z
    .string({ error: 'Choose a species.' })
    .trim()
    .min(1, { error: 'Choose a species.' })
    .max(80)
    .regex(/^[a-z]+(-[a-z]+)+$/, { error: 'Choose a species from the list.' }),
  stageNotes: z.string().trim().max(2000, { error: 'Keep the stage notes under 2000 characters.' }),
  containerShape: z.enum(containerShapes, { error: 'Choose round, rectangular or oval.' }).nullable(),
  containerLengthCm: dimension.nullable(),
  containerWidthCm: dimension.nullable(),
  acquiredOn: optionalDate,
  collectedFromWild: z.boolean({ error: 'Say whether the tree was collected from the wild.' }),
  collectedOn: optionalDate,
  notes: z.string().trim().max(4000, { error: 'Keep the notes under 4000 characters.' }),
});

type TreeFields = z.infer<typeof treeFieldsSchema>;

/** Rules that tie fields together; each issue names the field a grower has to fix. */
function crossCheck(t: TreeFields, ctx: z.RefinementCtx) {
  const today = todayIso();
  if (t.containerShape) {
    if (t.containerLengthCm == null) {
      ctx.addIssue({ code: 'custom', path: ['containerLengthCm'], message: t.containerShape === 'round' ? 'Give the diameter.' : 'Give the length.' });
    }
    if (t.containerShape !== 'round' && t.containerWidthCm == null) {
      ctx.addIssue({ code: 'custom', path: ['containerWidthCm'], message: 'Give the width.' });
    }
    if (t.containerShape !== 'round' && t.containerLengthCm != null && t.containerWidthCm != null && t.containerWidthCm > t.containerLengthCm) {
      ctx.addIssue({ code: 'custom', path: ['containerWidthCm'], message: 'The width is the shorter side: swap length and width.' });
    }
  } else if (t.containerLengthCm != null || t.containerWidthCm != null) {
    ctx.addIssue({ code: 'custom', path: ['containerShape'], message: 'Choose the container shape for these sizes.' });
  }
  if (t.acquiredOn && t.acquiredOn > today) {
    ctx.addIssue({ code: 'custom', path: ['acquiredOn'], message: 'The date acquired cannot be in the future.' });
  }
  if (t.collectedOn) {
    if (!t.collectedFromWild) {
      ctx.addIssue({ code: 'custom', path: ['collectedOn'], message: 'A collection date only applies to a tree collected from the wild.' });
    } else if (t.collectedOn > today) {
      ctx.addIssue({ code: 'custom', path: ['collectedOn'], message: 'The collection date cannot be in the future.' });
    }
  }
}

export const treeInputSchema = treeFieldsSchema.superRefine(crossCheck);
export type TreeInput = z.infer<typeof treeInputSchema>;

/** PATCH: any subset of the fields; the merged tree is checked again with `treeInputSchema`. */
export const treePatchSchema = treeFieldsSchema.partial().refine((p) => Object.keys(p).length > 0, { error: 'Change at least one field.' });
export type TreePatch = z.infer<typeof treePatchSchema>;

export const treeIdSchema = idSchema('tree');

export const emptyTree: TreeInput = {
  name: '',
  speciesSlug: '',
  stageNotes: '',
  containerShape: null,
  containerLengthCm: null,
  containerWidthCm: null,
  acquiredOn: null,
  collectedFromWild: false,
  collectedOn: null,
  notes: '',
};
