import { randomBytes } from 'node:crypto';

// Stored objects are named by the server only: `<folder>/<random>.<ext>`. A user's file name
// never becomes part of a key or a path.

export type StorageFolder = 'photos' | 'thumbs';
export type StorageExt = 'jpg' | 'png' | 'webp';

const keyPattern = /^(photos|thumbs)\/[A-Za-z0-9_-]{22}\.(jpg|png|webp)$/;

export function isStorageKey(key: string): boolean {
  return keyPattern.test(key);
}

export function newStorageKey(folder: StorageFolder, ext: StorageExt): string {
  return `${folder}/${randomBytes(16).toString('base64url')}.${ext}`;
}

export interface Storage {
  /** Writes the whole object or nothing (no half-written file is ever visible under the key). */
  put(key: string, data: Buffer): Promise<void>;
  /** The object's bytes, or null when it does not exist. */
  get(key: string): Promise<Buffer | null>;
  /** Removes the object; a missing one is not an error. */
  delete(key: string): Promise<void>;
}
