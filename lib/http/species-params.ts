import 'server-only';
import { z } from 'zod';
import { AppError } from '@/lib/errors';
import { slugSchema } from '@/lib/validation/species';

/** A slug that cannot exist is simply not found (the same answer as an unknown one). */
export function parseSlug(params: { slug: string }): string {
  const r = slugSchema.safeParse(params.slug);
  if (!r.success) throw new AppError('not_found:species', 'No species with that name.');
  return r.data;
}

export const revisionQuerySchema = z.object({
  revision: z.preprocess((v) => (v === '' ? undefined : v), z.coerce.number().int().min(1).max(1_000_000).optional()),
});
