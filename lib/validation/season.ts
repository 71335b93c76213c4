import { z } from 'zod';
import { parseIsoDate } from '@/lib/wizard/season';
import { MAX_DEGREE_DAYS } from '@/lib/season/degree-days';

// The season's inputs: daily temperatures for a heat sum, and the requests around a tree's plan.

export const seasonDateSchema = z
  .string({ error: 'Give the date as YYYY-MM-DD.' })
  .refine((s) => parseIsoDate(s) !== null, { error: 'Give a real date as YYYY-MM-DD.' });

// The coldest and hottest air temperatures ever measured lie inside −90…+60 °C.
const temperature = (name: string) =>
  z
    .number({ error: `Give ${name} in °C as a number.` })
    .min(-90, { error: `${name} below −90 °C is not a real reading.` })
    .max(60, { error: `${name} above 60 °C is not a real reading.` });

const dayTempsSchema = z
  .object({ date: seasonDateSchema, tmin: temperature('tmin'), tmax: temperature('tmax') })
  .refine((d) => d.tmin <= d.tmax, { error: 'tmin is above tmax on this day.', path: ['tmin'] });

export const degreeDaysBodySchema = z
  .object({
    base: z.number({ error: 'Give the base temperature in °C.' }).min(-10).max(30).default(5),
    days: z
      .array(dayTempsSchema, { error: 'Give the days as a list.' })
      .min(1, { error: 'Give at least one day.' })
      .max(MAX_DEGREE_DAYS, { error: `At most ${MAX_DEGREE_DAYS} days in one request.` }),
  })
  .superRefine((b, ctx) => {
    for (let i = 1; i < b.days.length; i++) {
      const prev = b.days[i - 1].date;
      const cur = b.days[i].date;
      if (cur === prev) ctx.addIssue({ code: 'custom', message: `${cur} is given twice.`, path: ['days', i, 'date'] });
      else if (cur < prev) ctx.addIssue({ code: 'custom', message: `${cur} comes after ${prev}: give the days in date order.`, path: ['days', i, 'date'] });
    }
  });
