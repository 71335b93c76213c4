import { z } from 'zod';

// One set of pot limits for a member's tree and for the wizard, so every valid tree can be asked about.
// Centimetres of the soil surface. At least 0.1 cm: PostgreSQL's real refuses tiny magnitudes (that was a 500).
export const POT_MIN_CM = 0.1;
/** Larger than any container we know of; a tree and the wizard both refuse more. // from memory */
export const POT_MAX_CM = 400;

export const potDimensionSchema = z
  .number({ error: 'Give the size in centimetres.' })
  .min(POT_MIN_CM, { error: `The size must be at least ${POT_MIN_CM} cm.` })
  .max(POT_MAX_CM, { error: `That is larger than any container we know (${POT_MAX_CM} cm at most).` });
