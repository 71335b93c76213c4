import { describe, expect, it } from 'vitest';
import { z } from 'zod';
import { findNul, parseWith } from '@/lib/http/route';
import { AppError } from '@/lib/errors';

// PostgreSQL cannot store U+0000 in text or jsonb: such input must be a 4xx naming the field,
// never a database error.
describe('NUL characters in input', () => {
  it('finds them in values and keys at any depth, with the path', () => {
    expect(findNul({ a: 'ok', b: ['x', { c: 'y\u0000z' }] })).toBe('b.1.c');
    expect(findNul({ ['k\u0000']: 1 })).toBe('k\u0000');
    expect(findNul('\u0000')).toBe('body');
    expect(findNul({ a: 'fine', n: 1, t: true, z: null })).toBeNull();
  });

  it('survives a very deep document', () => {
    let deep: unknown = 'end\u0000';
    for (let i = 0; i < 100_000; i++) deep = [deep];
    expect(findNul(deep)).toMatch(/^0(\.0)*$/);
  });

  it('parseWith refuses them with the status asked for and the field at fault', () => {
    const schema = z.object({ name: z.string() });
    const body = (() => {
      try {
        parseWith(schema, { name: 'Wren\u0000' });
      } catch (e) {
        return e as AppError;
      }
    })();
    expect(body?.status).toBe(422);
    expect(body?.fields).toEqual({ name: ['Must not contain NUL characters.'] });
    const query = (() => {
      try {
        parseWith(schema, { name: '\u0000' }, 400);
      } catch (e) {
        return e as AppError;
      }
    })();
    expect(query?.status).toBe(400);
    expect(parseWith(schema, { name: 'Wren' })).toEqual({ name: 'Wren' });
  });
});
