import { randomBytes } from 'node:crypto';

/** A short, unguessable id for URLs (96 random bits, base64url: 16 characters). */
export function newPublicId(): string {
  return randomBytes(12).toString('base64url');
}
