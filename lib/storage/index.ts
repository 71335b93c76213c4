import 'server-only';
import { env } from '@/lib/env';
import { LocalDirStorage } from './local';
import { S3Storage } from './s3';
import type { Storage } from './types';

export type { Storage } from './types';
export { newStorageKey } from './types';

const g = globalThis as unknown as { __cwStorage?: Storage };

/**
 * The process's storage: an S3-compatible bucket when `S3_URL` and `S3_BUCKET` are set (several
 * app processes then share the photos), otherwise a local directory (`UPLOADS_DIR`), the embedded
 * default.
 */
export function storage(): Storage {
  return (g.__cwStorage ??=
    env.S3_URL && env.S3_BUCKET
      ? new S3Storage({
          url: env.S3_URL,
          bucket: env.S3_BUCKET,
          region: env.S3_REGION,
          prefix: env.S3_PREFIX,
          accessKeyId: env.S3_ACCESS_KEY_ID,
          secretAccessKey: env.S3_SECRET_ACCESS_KEY,
        })
      : new LocalDirStorage(env.UPLOADS_DIR));
}
