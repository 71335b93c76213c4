import { DeleteObjectCommand, GetObjectCommand, NoSuchKey, PutObjectCommand, S3Client } from '@aws-sdk/client-s3';
import { isStorageKey, type Storage } from './types';

export interface S3StorageConfig {
  /** The store's endpoint, e.g. `http://127.0.0.1:4569` for a local fake or an S3-compatible host. */
  url: string;
  bucket: string;
  region?: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  /** Optional prefix inside the bucket, so several clubs can share one (no leading or trailing slash). */
  prefix?: string;
}

/**
 * Objects in an S3-compatible bucket through the AWS SDK. The bucket stays private: objects are
 * written without any public ACL and read back only by the server, which serves them through
 * its own authorised photo route. A PUT is atomic on S3 (an object appears whole or not at all),
 * which keeps the promise of `Storage.put`.
 */
export class S3Storage implements Storage {
  private readonly client: S3Client;
  private readonly bucket: string;
  private readonly prefix: string;

  constructor(cfg: S3StorageConfig) {
    this.client = new S3Client({
      endpoint: cfg.url,
      region: cfg.region ?? 'us-east-1',
      // Path-style addressing (`<endpoint>/<bucket>/<key>`) works on every S3-compatible store;
      // virtual-host style needs DNS for each bucket.
      forcePathStyle: true,
      credentials: cfg.accessKeyId && cfg.secretAccessKey ? { accessKeyId: cfg.accessKeyId, secretAccessKey: cfg.secretAccessKey } : undefined,
    });
    this.bucket = cfg.bucket;
    this.prefix = cfg.prefix ? `${cfg.prefix.replace(/^\/+|\/+$/g, '')}/` : '';
  }

  private keyOf(key: string): string {
    if (!isStorageKey(key)) throw new Error(`Refusing a storage key the server did not generate: ${JSON.stringify(key)}`);
    return this.prefix + key;
  }

  async put(key: string, data: Buffer): Promise<void> {
    await this.client.send(new PutObjectCommand({ Bucket: this.bucket, Key: this.keyOf(key), Body: data, ContentLength: data.byteLength }));
  }

  async get(key: string): Promise<Buffer | null> {
    try {
      const out = await this.client.send(new GetObjectCommand({ Bucket: this.bucket, Key: this.keyOf(key) }));
      if (!out.Body) return null;
      return Buffer.from(await out.Body.transformToByteArray());
    } catch (e) {
      if (
        e instanceof NoSuchKey ||
        (e as { name?: string }).name === 'NoSuchKey' ||
        (e as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404
      )
        return null;
      throw e;
    }
  }

  async delete(key: string): Promise<void> {
    // S3 answers 204 for a missing key as well: deleting what is not there is not an error.
    await this.client.send(new DeleteObjectCommand({ Bucket: this.bucket, Key: this.keyOf(key) }));
  }
}
