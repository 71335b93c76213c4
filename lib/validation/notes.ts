import { z } from 'zod';
import { boundedIsoDate, boundedIsoDateTime } from './bounds';
import { markdownProblem } from '@/lib/markdown/limits';

// Meeting notes: one schema for the editor form and for POST/PATCH /api/notes.

const noteStatuses = ['draft', 'published'] as const;
export type NoteStatus = (typeof noteStatuses)[number];

const MAX_NOTE_BODY = 100_000;

const noteFieldsSchema = z.object({
  title: z.string().trim().min(1, { error: 'Give the note a title.' }).max(160, { error: 'Keep the title under 160 characters.' }),
  meetingDate: boundedIsoDate('Give the meeting date, like 2027-03-14.'),
  body: z
    .string()
    .max(MAX_NOTE_BODY, { error: `Keep the note under ${MAX_NOTE_BODY.toLocaleString('en')} characters.` })
    .superRefine((s, ctx) => {
      const problem = markdownProblem(s);
      if (problem) ctx.addIssue({ code: 'custom', message: problem });
    }),
  status: z.enum(noteStatuses, { error: 'Choose draft or published.' }),
});

export const noteInputSchema = noteFieldsSchema;
export type NoteInput = z.infer<typeof noteInputSchema>;

/** PATCH: any subset; `expectedUpdatedAt` (from the loaded note) refuses a stale edit with 409. */
export const notePatchSchema = noteFieldsSchema
  .partial()
  .extend({ expectedUpdatedAt: boundedIsoDateTime('Not a timestamp.').optional() })
  .refine((p) => Object.keys(p).some((k) => k !== 'expectedUpdatedAt'), { error: 'Change at least one field.' });
export type NotePatch = z.infer<typeof notePatchSchema>;

export const noteListQuerySchema = z.object({
  q: z.string().trim().max(100).optional(),
  status: z.enum(noteStatuses).optional(),
});

export const noteSlugSchema = z
  .string()
  .regex(/^\d{4}-\d{2}-\d{2}(-[a-z0-9]+)*$/)
  .max(120);

export const notePreviewSchema = z.object({ body: noteFieldsSchema.shape.body });

export const linkableAnswersQuerySchema = z.object({
  species: z.string().trim().max(80).optional(),
  action: z.enum(['pinch', 'prune', 'let-grow', 'decandle', 'wait']).optional(),
  member: z.string().trim().max(80).optional(),
  from: boundedIsoDate().optional(),
  to: boundedIsoDate().optional(),
});
export type LinkableAnswersQuery = z.infer<typeof linkableAnswersQuerySchema>;

export const sendDigestSchema = z.object({ confirm: z.boolean().optional() });

/** `2027-03-14` + "Spring candle workshop" → `2027-03-14-spring-candle-workshop`. */
export function noteSlugFor(meetingDate: string, title: string): string {
  const words = title
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 80)
    .replace(/-+$/g, '');
  return words ? `${meetingDate}-${words}` : meetingDate;
}

/** 14 March 2027 (the calendar date as written, no time zone shift). */
export function formatMeetingDate(iso: string): string {
  const [y, m, d] = iso.split('-').map(Number);
  return new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' }).format(new Date(Date.UTC(y, m - 1, d)));
}
