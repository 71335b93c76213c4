import { describe, expect, it } from 'vitest';
import { settingsSchema } from '@/lib/validation/auth';
import { mmRange, speciesListQuerySchema } from '@/lib/validation/species';
import { treeFieldsSchema } from '@/lib/validation/trees';

// PostgreSQL's `real` refuses magnitudes below about 1e-38 ("out of range for type real"), so a
// tiny number that passed validation became a 500 on PostgreSQL (found by the fuzz suite).
// Every field stored in a real column must refuse or round such numbers.
const tiny = 1e-320;

describe('numbers bound for real columns', () => {
  it('club latitude is rounded to a millionth of a degree', () => {
    const r = settingsSchema.parse({ clubName: 'Riverside Pine Study Group', hemisphere: 'north', defaultLatitude: tiny });
    expect(r.defaultLatitude).toBe(0);
    expect(Object.is(r.defaultLatitude, -0)).toBe(false);
    expect(settingsSchema.parse({ clubName: 'x', hemisphere: 'south', defaultLatitude: -33.8688197 }).defaultLatitude).toBe(-33.86882);
  });

  it('needle lengths and the needle filter refuse sizes under 0.1 mm', () => {
    expect(mmRange.safeParse({ min: tiny, max: 10 }).success).toBe(false);
    expect(mmRange.safeParse({ min: 0.1, max: 10 }).success).toBe(true);
    expect(speciesListQuerySchema.safeParse({ needleMin: String(tiny) }).success).toBe(false);
  });

  it('container sizes refuse anything under 0.1 cm', () => {
    const r = treeFieldsSchema.shape.containerLengthCm.safeParse(tiny);
    expect(r.success).toBe(false);
    expect(treeFieldsSchema.shape.containerLengthCm.safeParse(25).success).toBe(true);
  });
});
