import { z } from 'zod';
import { idSchema } from '@/lib/ids';

const itemId = z.string().regex(/^[A-Za-z0-9_-]{6,40}$/, { error: 'Not a valid id.' });

/** Which item a photo belongs to: exactly one of a tree or an answer. */
export const photoTargetSchema = z
  .object({ treeId: itemId.optional(), answerId: itemId.optional() })
  .refine((t) => !!t.treeId !== !!t.answerId, { error: 'Give either treeId or answerId.', path: ['treeId'] })
  .transform((t) => (t.treeId ? { treeId: t.treeId } : { answerId: t.answerId! }));

export const photoIdSchema = idSchema('photo');

export const photoSizeSchema = z.object({ size: z.enum(['full', 'thumb']).default('full') });

/**
 * The file name a client sends is never used to store anything (keys are generated), but a name
 * holding a path, a NUL or another control character is no honest upload — browsers send the
 * bare file name — so it is refused outright.
 */
export function isAcceptableUploadName(name: string): boolean {
  return name.length > 0 && name.length <= 255 && !/[\/\\\u0000-\u001f\u007f]/.test(name) && name !== '.' && name !== '..';
}
