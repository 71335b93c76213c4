import type { ZodError } from 'zod';
import type { FieldErrors } from '@/lib/errors';

/** Flatten a zod error into `{ 'path.to.field': [messages] }`; the root is called `body`. */
export function fieldErrorsOf(error: ZodError): FieldErrors {
  const out: FieldErrors = {};
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.map(String).join('.') : 'body';
    (out[key] ??= []).push(issue.message);
  }
  return out;
}
