import { z } from 'zod';

// Bounds for every date, number and cursor that reaches the database. PostgreSQL refuses year
// 0000 dates, years beyond its range and integers past 32 bits with an error, which was a 500:
// here they are a 4xx naming the field. The bounds are the product's, not the database's: no
// tree, meeting or answer in a club record is dated before 1800 or after 2200.
const MIN_YEAR = 1800;
const MAX_YEAR = 2200;
/** The largest PostgreSQL `integer` (a signed 32-bit value). */
export const INT4_MAX = 2_147_483_647;

const yearOf = (iso: string) => Number(iso.slice(0, 4));
const yearMessage = `Use a year from ${MIN_YEAR} to ${MAX_YEAR}.`;

/** An ISO calendar date (YYYY-MM-DD) inside the product's years. */
export function boundedIsoDate(message = 'Use a date like 2026-04-12.') {
  return z.iso.date({ error: message }).refine((s) => yearOf(s) >= MIN_YEAR && yearOf(s) <= MAX_YEAR, { error: yearMessage });
}

/** An ISO timestamp inside the product's years. */
export function boundedIsoDateTime(message = 'Not a timestamp.') {
  return z.iso.datetime({ error: message }).refine((s) => yearOf(s) >= MIN_YEAR && yearOf(s) <= MAX_YEAR, { error: yearMessage });
}

/** A positive whole number that fits a PostgreSQL integer column. */
export function positiveInt4() {
  return z
    .number()
    .int()
    .min(1)
    .max(INT4_MAX, { error: `At most ${INT4_MAX}.` });
}

/** A Date read from a cursor or query: finite and inside the product's years. */
export function isBoundedDate(d: Date): boolean {
  const t = d.getTime();
  if (!Number.isFinite(t)) return false;
  const y = d.getUTCFullYear();
  return y >= MIN_YEAR && y <= MAX_YEAR;
}
