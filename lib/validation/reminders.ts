import { z } from 'zod';
import { boundedIsoDate } from './bounds';

/** `POST /api/admin/reminders/run`: the week to remind about (any day of it; default this week). */
export const reminderRunSchema = z.strictObject({
  weekOf: boundedIsoDate('Use the date of a day in the week, like 2027-05-10.').optional(),
});

/** Reminder run ids are public ids (lib/ids.ts newPublicId). */
export const reminderRunParams = z.object({ id: z.string().regex(/^[A-Za-z0-9_-]{8,40}$/) });
