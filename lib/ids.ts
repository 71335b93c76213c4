import { z } from 'zod';
import { AppError } from '@/lib/errors';

// Web Crypto only (no node:crypto), so the patterns can be imported by client forms too.
function randomBase64url(bytes: number): string {
  const b = crypto.getRandomValues(new Uint8Array(bytes));
  return btoa(String.fromCharCode(...b))
    .replace(/\+/g, '-')
    .replace(/\//g, '_')
    .replace(/=+$/, '');
}

// Every id the app hands out: how it is made and what it looks like. A value that does not look
// like an id of its kind cannot name anything, so it is answered like an unknown one: 404.

/** A short, unguessable id for URLs (96 random bits, base64url: 16 characters). Trees, photos, reminder runs. */
export function newPublicId(): string {
  return randomBase64url(12);
}

/** 12 characters of base64url from 9 random bytes (72 bits): short and unguessable. Answers. */
export function newAnswerId(): string {
  return randomBase64url(9);
}

/** Users get a UUID from the database default (db/schema.ts), next-auth's adapter included. */
export function newUserId(): string {
  return crypto.randomUUID();
}

export const idPatterns = {
  answer: /^[A-Za-z0-9_-]{10,32}$/,
  tree: /^[A-Za-z0-9_-]{8,40}$/,
  photo: /^[A-Za-z0-9_-]{8,40}$/,
  /** Weekly reminder runs (newPublicId). */
  reminder_run: /^[A-Za-z0-9_-]{8,40}$/,
  user: /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i,
} as const;
export type IdKind = keyof typeof idPatterns;

export const answerIdPattern = idPatterns.answer;

/** A zod schema for an id of `kind` (use as route() `params`, with `notFound: kind`). */
export function idSchema(kind: IdKind) {
  return z.string().regex(idPatterns[kind]);
}

export function isId(kind: IdKind, value: unknown): value is string {
  return typeof value === 'string' && idPatterns[kind].test(value);
}

/** The id, or a 404 `not_found:<kind>` when it cannot be one. */
export function parseId(kind: IdKind, value: unknown): string {
  if (!isId(kind, value)) throw new AppError(`not_found:${kind}`, `No such ${kind}.`);
  return value;
}
