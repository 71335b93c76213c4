import { describe, expect, it } from 'vitest';
import { idPatterns, isId, newAnswerId, newPublicId, newUserId, parseId } from '@/lib/ids';
import { treeIdSchema } from '@/lib/validation/trees';
import { photoIdSchema } from '@/lib/validation/uploads';

// One module makes and recognises every id: what it makes, it recognises, and a malformed value
// is a 404 of its kind.
describe('ids', () => {
  it('recognises every id it makes, and makes them unique', () => {
    const made = { answer: newAnswerId, tree: newPublicId, photo: newPublicId, user: newUserId } as const;
    for (const [kind, make] of Object.entries(made) as [keyof typeof made, () => string][]) {
      const ids = new Set(Array.from({ length: 500 }, make));
      expect(ids.size, kind).toBe(500);
      for (const id of ids) expect(isId(kind, id), `${kind} ${id}`).toBe(true);
    }
    expect(treeIdSchema.safeParse(newPublicId()).success).toBe(true);
    expect(photoIdSchema.safeParse(newPublicId()).success).toBe(true);
  });

  it('answers a malformed id with not_found of its kind', () => {
    for (const kind of Object.keys(idPatterns) as (keyof typeof idPatterns)[]) {
      for (const bad of ['', 'x', '../etc/passwd', 'a'.repeat(200), "1' OR '1'='1", null, 42]) {
        expect(() => parseId(kind, bad)).toThrow(expect.objectContaining({ status: 404, code: `not_found:${kind}` }));
      }
    }
  });
});
