import 'server-only';
import { env } from '@/lib/env';
import { LocalDirStorage } from './local';
import type { Storage } from './types';

export type { Storage } from './types';
export { isStorageKey, newStorageKey } from './types';

const g = globalThis as unknown as { __cwStorage?: Storage };

/** The process's storage. The default writes to a local directory (`UPLOADS_DIR`). */
export function storage(): Storage {
  return (g.__cwStorage ??= new LocalDirStorage(env.UPLOADS_DIR));
}

/** For tests: use another storage (e.g. a temporary directory). */
export function setStorage(s: Storage) {
  g.__cwStorage = s;
}
