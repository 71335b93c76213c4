import { z } from 'zod';
import { boundedIsoDate } from './bounds';
import { idSchema } from '@/lib/ids';

/** `POST /api/admin/reminders/run`: the week to remind about (any day of it; default this week). */
export const reminderRunSchema = z.strictObject({
  weekOf: boundedIsoDate('Use the date of a day in the week, like 2027-05-10.').optional(),
});

export const reminderRunParams = z.object({ id: idSchema('reminder_run') });
