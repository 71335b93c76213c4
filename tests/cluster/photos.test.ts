import fs from 'node:fs';
import sharp from 'sharp';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, signedIn } from '../support/http-client';
import { jpegPhoto, pngPhoto } from '../support/images';
import { pathNameTargets, refusedUploads, upload } from '../support/upload-cases';
import { A, B, bucketKeys, newTree, sameBrowserOn } from './helpers';

// Photos in the S3 bucket both processes share: an upload through A is served by B, only to those
// who may see it; the hostile and oversize uploads the local store refuses are refused here too,
// and leave nothing in the bucket.
const localUploadsDir = inject('localUploadsDir');

function localFiles(): string[] {
  return fs.existsSync(localUploadsDir) ? fs.readdirSync(localUploadsDir, { recursive: true }).map(String) : [];
}

let memberA: Client;
let memberB: Client;
let otherB: Client;
let treeId: string;

beforeAll(async () => {
  memberA = await signedIn(A, 'member@candlewise.test');
  memberB = sameBrowserOn(memberA, B);
  otherB = await signedIn(B, 'member2@candlewise.test');
  treeId = await newTree(memberA, 'Two-process mugo');
});

describe('a photo uploaded through A', () => {
  it('goes to the bucket, not to a local directory, and B serves the same image', async () => {
    const before = await bucketKeys();
    const up = await upload(memberA, { treeId }, await jpegPhoto(1200, 900, { gps: true }), 'shoot.jpg', 'image/jpeg');
    expect(up.status, JSON.stringify(up.body)).toBe(201);
    const photo = up.body.photo;
    const added = (await bucketKeys()).filter((k) => !before.includes(k));
    expect(added).toHaveLength(2); // the re-encoded photo and its thumbnail
    expect(localFiles()).toEqual([]);

    const fromA = await memberA.get(photo.url);
    const fromB = await memberB.get(photo.url);
    expect(fromB.status).toBe(200);
    expect(fromB.headers.get('content-type')).toBe('image/jpeg');
    expect(fromB.headers.get('x-content-type-options')).toBe('nosniff');
    const bytesB = Buffer.from(await fromB.arrayBuffer());
    expect(bytesB.equals(Buffer.from(await fromA.arrayBuffer()))).toBe(true);
    const meta = await sharp(bytesB).metadata();
    expect(meta).toMatchObject({ format: 'jpeg', width: 1200, height: 900 });
    expect(meta.exif).toBeUndefined();

    const thumbB = await memberB.get(photo.thumbUrl);
    expect(thumbB.headers.get('content-type')).toBe('image/webp');
    expect((await sharp(Buffer.from(await thumbB.arrayBuffer())).metadata()).width).toBe(400);
    expect((await memberB.json(`/api/uploads?treeId=${treeId}`, 'GET')).body.items.map((p: { id: string }) => p.id)).toContain(photo.id);
  });

  it('is refused by B to another member and to the anonymous; deleted through B, it is gone from A and the bucket', async () => {
    const before = await bucketKeys();
    const up = await upload(memberA, { treeId }, await pngPhoto(), 'p.png', 'image/png');
    expect(up.status).toBe(201);
    const id = up.body.photo.id;
    expect((await otherB.get(`/api/uploads/${id}`)).status).toBe(404);
    expect((await otherB.get(`/api/uploads/${id}?size=thumb`)).status).toBe(404);
    expect((await otherB.json(`/api/uploads?treeId=${treeId}`, 'GET')).status).toBe(404);
    expect((await otherB.json(`/api/uploads/${id}`, 'DELETE')).status).toBe(404);
    expect((await new Client(B).get(`/api/uploads/${id}`)).status).toBe(401);

    expect((await memberB.get(`/api/uploads/${id}`)).status).toBe(200);
    expect((await memberB.json(`/api/uploads/${id}`, 'DELETE')).status).toBe(204);
    expect((await memberA.get(`/api/uploads/${id}`)).status).toBe(404);
    expect(await bucketKeys()).toEqual(before);
  });
});

describe('uploads the S3 store refuses', () => {
  for (const { label, make, name, type, status } of refusedUploads) {
    it(`refuses ${label} with ${status} and stores nothing`, async () => {
      const before = await bucketKeys();
      const listBefore = (await memberB.json(`/api/uploads?treeId=${treeId}`, 'GET')).body.items.length;
      const res = await upload(memberA, { treeId }, await make(), name, type);
      expect(res.status).toBe(status);
      expect(res.body.error.fields.file[0]).toBeTruthy();
      expect(await bucketKeys()).toEqual(before);
      expect(localFiles()).toEqual([]);
      for (const p of pathNameTargets) expect(fs.existsSync(p), p).toBe(false);
      expect((await memberB.json(`/api/uploads?treeId=${treeId}`, 'GET')).body.items.length).toBe(listBefore);
    });
  }
});
