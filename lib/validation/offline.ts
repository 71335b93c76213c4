import { z } from 'zod';
import { actions } from '@/lib/wizard/types';
import { saveAnswerSchema } from './wizard';

// What a phone adds when it saves an answer it worked out offline, and the key that makes the
// save safe to retry. Shared by the offline queue (client) and POST /api/answers (server).

/** Letters, digits, `-` and `_`: a UUID fits, and so does any key a client makes from random bytes. */
export const idempotencyKeySchema = z.string().regex(/^[A-Za-z0-9_-]{16,100}$/, { error: 'Send an Idempotency-Key of 16 to 100 letters, digits, - or _.' });

export const IDEMPOTENCY_HEADER = 'Idempotency-Key';

/**
 * The phone's own answer, kept beside the server's when they differ. Only the fields the answer
 * screen compares are checked; the rest of the result is kept as sent, within the body cap.
 */
const phoneResultSchema = z.looseObject({
  action: z.enum(actions),
  headline: z.string().max(300),
  engineVersion: z.string().max(40),
  speciesRevision: z.number().int().min(0),
  reasons: z.array(z.looseObject({ rule: z.string().max(80), text: z.string().max(2000) })).max(60),
});

export type PhoneResult = z.infer<typeof phoneResultSchema>;

export const saveAnswerWithPhoneSchema = z.intersection(saveAnswerSchema, z.object({ phoneResult: phoneResultSchema.optional() }));
export type SaveAnswerWithPhoneBody = z.infer<typeof saveAnswerWithPhoneSchema>;
