// Growing degree days by the simple average method, in °C:
//   daily = max(0, (tmin + tmax) / 2 − base)
// the first interpretation in "Growing degree-days: one equation, two
// interpretations" (Agric. For. Meteorol. 87:291–300, 1997): the daily mean is floored at the base, no
// substitution of tmin. Pure: no I/O, so the API, the plan and the record chart share it.

export interface DayTemps {
  date: string;
  tmin: number;
  tmax: number;
}

interface CumulativeDay {
  date: string;
  gdd: number;
}

export interface DegreeDayTotals {
  base: number;
  total: number;
  cumulative: CumulativeDay[];
}

/** The most days one request may sum (a little over two years). */
export const MAX_DEGREE_DAYS = 800;
/** +5 °C: the base used for Scots pine shoot growth (“Intra-annual height increment of Pinus sylvestris at high latitudes in Finland”, Tree Physiology 27(9):1347–1353 (2007)). */
export const DEFAULT_BASE_C = 5;

/** Degree days of one day (°C·d). */
export function dailyDegreeDays(tmin: number, tmax: number, base = DEFAULT_BASE_C): number {
  return Math.max(0, (tmin + tmax) / 2 - base);
}

const round2 = (x: number) => Math.round(x * 100) / 100;

/** Running heat sum over days already checked to be ordered and unique. Values rounded to 0.01. */
export function accumulate(days: readonly DayTemps[], base = DEFAULT_BASE_C): DegreeDayTotals {
  let sum = 0;
  const cumulative = days.map((d) => {
    sum += dailyDegreeDays(d.tmin, d.tmax, base);
    return { date: d.date, gdd: round2(sum) };
  });
  return { base, total: round2(sum), cumulative };
}

/** Whole days from a to b (ISO dates). */
export function daysBetween(a: string, b: string): number {
  return Math.round((Date.parse(`${b}T00:00:00Z`) - Date.parse(`${a}T00:00:00Z`)) / 86_400_000);
}

/** a + n days, as an ISO date. */
export function addDays(iso: string, n: number): string {
  return new Date(Date.parse(`${iso}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
}
