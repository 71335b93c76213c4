import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { S3Client, GetObjectAclCommand, ListObjectsV2Command } from '@aws-sdk/client-s3';
import { S3Storage } from '@/lib/storage/s3';
import { newStorageKey } from '@/lib/storage/types';
import { startFakeS3, type FakeS3 } from '../support/fake-s3';

// The S3 store against a local S3-compatible server: the same promises the local directory
// store keeps (tests/unit/photo-processing.test.ts), plus keys under the configured prefix and
// nothing written with a public ACL.
let s3: FakeS3;
let store: S3Storage;
beforeAll(async () => {
  s3 = await startFakeS3();
  store = new S3Storage({ url: s3.url, bucket: s3.bucket, accessKeyId: s3.accessKeyId, secretAccessKey: s3.secretAccessKey, prefix: 'club-a' });
}, 30_000);
afterAll(async () => s3?.stop());

const raw = () =>
  new S3Client({
    endpoint: s3.url,
    region: 'us-east-1',
    forcePathStyle: true,
    credentials: { accessKeyId: s3.accessKeyId, secretAccessKey: s3.secretAccessKey },
  });

describe('S3 storage', () => {
  it('writes, reads and deletes whole objects under generated keys, inside its prefix', async () => {
    const key = newStorageKey('photos', 'jpg');
    const bytes = Buffer.from(Array.from({ length: 70_000 }, (_, i) => i % 251));
    await store.put(key, bytes);
    expect((await store.get(key))?.equals(bytes)).toBe(true);
    const listed = await raw().send(new ListObjectsV2Command({ Bucket: s3.bucket }));
    expect(listed.Contents?.map((o) => o.Key)).toContain(`club-a/${key}`);
    await store.delete(key);
    expect(await store.get(key)).toBeNull();
  });

  it('answers null for a missing object and deletes a missing one without error', async () => {
    const key = newStorageKey('thumbs', 'webp');
    expect(await store.get(key)).toBeNull();
    await expect(store.delete(key)).resolves.toBeUndefined();
  });

  it("keeps another prefix apart: a second club on the same bucket sees none of the first club's photos", async () => {
    const key = newStorageKey('photos', 'png');
    await store.put(key, Buffer.from('club a only'));
    const other = new S3Storage({ url: s3.url, bucket: s3.bucket, accessKeyId: s3.accessKeyId, secretAccessKey: s3.secretAccessKey, prefix: 'club-b' });
    expect(await other.get(key)).toBeNull();
  });

  it('refuses names a user could have chosen, traversal and NUL bytes', async () => {
    for (const key of ['photos/../../etc/passwd.jpg', '../x.jpg', 'photos/holiday.jpg', 'photos/aaaaaaaaaaaaaaaaaaaaaa.jpg\0.png', '/etc/passwd']) {
      await expect(store.put(key, Buffer.from('x'))).rejects.toThrow(/did not generate/);
      await expect(store.get(key)).rejects.toThrow(/did not generate/);
    }
  });

  it('writes no public grant: the object ACL names its owner only', async () => {
    const key = newStorageKey('photos', 'jpg');
    await store.put(key, Buffer.from('private'));
    const acl = await raw().send(new GetObjectAclCommand({ Bucket: s3.bucket, Key: `club-a/${key}` }));
    const publicGrants = (acl.Grants ?? []).filter((g) => /AllUsers|AuthenticatedUsers/.test(g.Grantee?.URI ?? ''));
    expect(publicGrants).toEqual([]);
  });
});
