import { inject } from 'vitest';
import { ListObjectsV2Command, S3Client } from '@aws-sdk/client-s3';
import { Client } from '../support/http-client';

export const A = inject('urlA');
export const B = inject('urlB');

/** The same browser (its cookies, kept in step) talking to another process of the cluster. */
export function sameBrowserOn(c: Client, base: string): Client {
  const other = new Client(base);
  other.cookies = c.cookies;
  return other;
}

/** A new tree of `c`'s. */
export async function newTree(c: Client, name: string, speciesSlug = 'pinus-mugo'): Promise<string> {
  const r = await c.json('/api/trees', 'POST', {
    name,
    speciesSlug,
    stageNotes: '',
    containerShape: 'round',
    containerLengthCm: 30,
    containerWidthCm: null,
    acquiredOn: null,
    collectedFromWild: false,
    collectedOn: null,
    notes: '',
  });
  if (r.status !== 201) throw new Error(`tree: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body.tree.id as string;
}

const s3cfg = inject('s3');
const s3 = new S3Client({
  endpoint: s3cfg.url,
  region: 'us-east-1',
  forcePathStyle: true,
  credentials: { accessKeyId: s3cfg.accessKeyId, secretAccessKey: s3cfg.secretAccessKey },
});

/** Every object key in the cluster's bucket, sorted. */
export async function bucketKeys(): Promise<string[]> {
  const keys: string[] = [];
  let token: string | undefined;
  do {
    const out = await s3.send(new ListObjectsV2Command({ Bucket: s3cfg.bucket, ContinuationToken: token }));
    keys.push(...(out.Contents ?? []).map((o) => o.Key!));
    token = out.IsTruncated ? out.NextContinuationToken : undefined;
  } while (token);
  return keys.sort();
}
