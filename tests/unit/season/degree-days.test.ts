import { describe, expect, it } from 'vitest';
import { accumulate, addDays, dailyDegreeDays, MAX_DEGREE_DAYS } from '@/lib/season/degree-days';
import { degreeDaysBodySchema } from '@/lib/validation/season';
import { fieldErrorsOf } from '@/lib/validation/fields';

describe('daily degree days, simple average method, against published worked examples', () => {
  it('Midwestern Regional Climate Center: a mean of 75 °F at base 65 °F gives 10', () => {
    // source: Midwestern Regional Climate Center (mrcc.illinois.edu), degree-day definitions
    expect(dailyDegreeDays(65, 85, 65)).toBe(10);
  });
  it('MRCC: a mean at or below the base gives zero, never a negative day', () => {
    // source: Midwestern Regional Climate Center: "If the mean temperature is at or below TBASE … zero"
    expect(dailyDegreeDays(50, 60, 65)).toBe(0);
    expect(dailyDegreeDays(-8, 2, 5)).toBe(0);
  });
  it('Iowa State University Agron 541: 70/50 °F at base 50 °F gives 10', () => {
    // source: Iowa State University, Agronomy 541 growing degree day example
    expect(dailyDegreeDays(50, 70, 50)).toBe(10);
  });
  it('Alberta Wheat Commission inputs, Tmax 23 °C, Tmin 8 °C, base 5 °C → 10.5', () => {
    // source: Alberta Wheat Commission, "What are growing degree days?" (The Growing Point, 2019); inputs theirs
    expect(dailyDegreeDays(8, 23, 5)).toBe(10.5);
  });
  it('UW–Madison SAGE atlas notes: Tmax 21, Tmin 15 gives 8 at base 10 and 13 at base 5', () => {
    // source: UW–Madison Nelson Institute SAGE, "Growing degree days" atlas map notes
    expect(dailyDegreeDays(15, 21, 10)).toBe(8);
    expect(dailyDegreeDays(15, 21, 5)).toBe(13);
  });
  it('Canola Council of Canada: Tmax 20, Tmin 10, base 0 → 15', () => {
    // source: Canola Council of Canada, Canola Watch "Map of the week" (2014)
    expect(dailyDegreeDays(10, 20, 0)).toBe(15);
  });
  it('uses the floored-mean interpretation of "Growing degree-days: one equation, two interpretations" (1997), not tmin raised to the base', () => {
    // source: "Growing degree-days: one equation, two interpretations", Agric. For. Meteorol. 87:291–300 (1997): method 1 floors the mean;
    // method 2 would raise tmin 0 to base 10 and give (10 + 20) / 2 − 10 = 5.
    expect(dailyDegreeDays(0, 20, 10)).toBe(0);
  });
});

describe('the running sum', () => {
  it('adds day by day and returns the total as the last cumulative value', () => {
    const days = [
      { date: '2027-03-01', tmin: 2, tmax: 11 }, // 1.5
      { date: '2027-03-02', tmin: 8, tmax: 22 }, // 10
      { date: '2027-03-03', tmin: -3, tmax: 4 }, // 0
      { date: '2027-03-04', tmin: 8, tmax: 23 }, // 10.5
    ];
    const out = accumulate(days, 5);
    expect(out.cumulative.map((c) => c.gdd)).toEqual([1.5, 11.5, 11.5, 22]);
    expect(out.total).toBe(22);
    expect(out.base).toBe(5);
  });
});

describe('the request body', () => {
  const day = (date: string, tmin = 2, tmax = 11) => ({ date, tmin, tmax });
  const errors = (body: unknown) => {
    const r = degreeDaysBodySchema.safeParse(body);
    return r.success ? null : fieldErrorsOf(r.error);
  };

  it('defaults the base to +5 °C', () => {
    expect(degreeDaysBodySchema.parse({ days: [day('2027-03-01')] }).base).toBe(5);
  });
  it('names the bad date', () => {
    expect(Object.keys(errors({ days: [day('2027-03-01'), day('2027-02-30')] })!)).toEqual(['days.1.date']);
    expect(errors({ days: [day('01/03/2027')] })).toHaveProperty(['days.0.date']);
  });
  it('refuses tmin above tmax', () => {
    expect(errors({ days: [day('2027-03-01', 12, 11)] })).toHaveProperty(['days.0.tmin']);
  });
  it('refuses a duplicate day and days out of order', () => {
    expect(errors({ days: [day('2027-03-01'), day('2027-03-01')] })!['days.1.date'][0]).toMatch(/twice/);
    expect(errors({ days: [day('2027-03-02'), day('2027-03-01')] })!['days.1.date'][0]).toMatch(/order/);
  });
  it(`refuses more than ${MAX_DEGREE_DAYS} days and takes exactly ${MAX_DEGREE_DAYS}`, () => {
    const many = (n: number) => Array.from({ length: n }, (_, i) => day(addDays('2025-01-01', i)));
    expect(errors({ days: many(MAX_DEGREE_DAYS) })).toBeNull();
    expect(errors({ days: many(MAX_DEGREE_DAYS + 1) })).toHaveProperty('days');
  });
  it('refuses readings that are not real temperatures', () => {
    expect(errors({ days: [day('2027-03-01', -200, 11)] })).toHaveProperty(['days.0.tmin']);
    expect(errors({ days: [{ date: '2027-03-01', tmin: '2', tmax: 11 }] })).toHaveProperty(['days.0.tmin']);
  });
});
