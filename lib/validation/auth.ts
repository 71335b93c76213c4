import { z } from 'zod';
import { isCommonPassword } from '@/lib/auth/common-passwords';

const emailSchema = z
  .string({ error: 'Enter your e-mail address.' })
  .trim()
  .toLowerCase()
  .pipe(z.email({ error: 'Enter a valid e-mail address.' }).max(254));

const passwordSchema = z
  .string({ error: 'Enter a password.' })
  .min(8, { error: 'Use at least 8 characters.' })
  .max(128, { error: 'Use at most 128 characters.' })
  .refine((p) => !isCommonPassword(p), { error: 'That password is on every list of common passwords: choose another.' });

export const signUpSchema = z.object({
  name: z.string().trim().min(1, { error: 'Tell us your name.' }).max(80),
  email: emailSchema,
  password: passwordSchema,
});
export type SignUpInput = z.infer<typeof signUpSchema>;

export const signInSchema = z.object({
  email: emailSchema,
  password: z.string().min(1).max(128),
});

const roleSchema = z.enum(['member', 'editor', 'librarian', 'admin']);

export const userPatchSchema = z
  .object({ role: roleSchema.optional(), disabled: z.boolean().optional() })
  .refine((v) => v.role !== undefined || v.disabled !== undefined, { error: 'Change the role or the disabled flag.' });

export const profilePatchSchema = z.object({
  name: z.string().trim().min(1).max(80).optional(),
  digestOptIn: z.boolean().optional(),
  reminderOptIn: z.boolean().optional(),
});

export const settingsSchema = z.object({
  clubName: z.string().trim().min(1, { error: 'Give the club a name.' }).max(120),
  hemisphere: z.enum(['north', 'south']),
  defaultLatitude: z.coerce
    .number()
    .min(-90, { error: 'Latitude runs from -90 to 90.' })
    .max(90, { error: 'Latitude runs from -90 to 90.' })
    // Stored as a PostgreSQL real, which refuses magnitudes below ~1e-38 (1e-320 was a 500 on
    // PostgreSQL): a millionth of a degree (about 0.1 m) is all a latitude needs.
    .transform((v) => Math.round(v * 1e6) / 1e6 + 0),
  // Moves the wizard's decandle window earlier (negative) or later (positive) for the local season.
  decandleOffsetDays: z.coerce
    .number({ error: 'Give a whole number of days.' })
    .int({ error: 'Give a whole number of days.' })
    .min(-30, { error: 'Move the window by at most 30 days.' })
    .max(30, { error: 'Move the window by at most 30 days.' })
    .default(0),
});
export type SettingsInput = z.infer<typeof settingsSchema>;
