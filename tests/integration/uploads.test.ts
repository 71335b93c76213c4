import fs from 'node:fs';
import path from 'node:path';
import sharp from 'sharp';
import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, signedIn } from '../support/http-client';
import { jpegPhoto, pngPhoto } from '../support/images';
import { pathNameTargets, refusedUploads, upload } from '../support/upload-cases';

const base = inject('baseUrl');
const uploadsDir = path.join(inject('dataDir'), 'uploads');

function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((d) => d.isFile())
    .map((d) => path.join(d.parentPath, d.name))
    .sort();
}

async function newTree(c: Client, name: string) {
  const { status, body } = await c.json('/api/trees', 'POST', {
    name,
    speciesSlug: 'pinus-mugo',
    stageNotes: '',
    containerShape: 'round',
    containerLengthCm: 30,
    containerWidthCm: null,
    acquiredOn: null,
    collectedFromWild: false,
    collectedOn: null,
    notes: '',
  });
  expect(status).toBe(201);
  return body.tree.id as string;
}

let member: Client;
let other: Client;
let treeId: string;

beforeAll(async () => {
  member = await signedIn(base, 'member@candlewise.test');
  other = await signedIn(base, 'member2@candlewise.test');
  treeId = await newTree(member, 'Photo mugo');
});

describe('photo uploads', () => {
  it('stores a re-encoded JPEG under a generated name and serves it with its type and nosniff', async () => {
    const res = await upload(member, { treeId }, await jpegPhoto(1200, 900, { gps: true }), 'evil name.jpg', 'image/jpeg');
    expect(res.status).toBe(201);
    const photo = res.body.photo;
    expect(photo).toMatchObject({ mime: 'image/jpeg', width: 1200, height: 900, mine: true });
    expect(filesUnder(uploadsDir).some((f) => f.includes('evil'))).toBe(false);
    expect(filesUnder(uploadsDir).every((f) => f.startsWith(uploadsDir + path.sep))).toBe(true);

    const full = await member.get(photo.url);
    expect(full.status).toBe(200);
    expect(full.headers.get('content-type')).toBe('image/jpeg');
    expect(full.headers.get('x-content-type-options')).toBe('nosniff');
    const bytes = Buffer.from(await full.arrayBuffer());
    const meta = await sharp(bytes).metadata();
    expect(meta.format).toBe('jpeg');
    expect(meta.exif).toBeUndefined();

    const thumb = await member.get(photo.thumbUrl);
    expect(thumb.headers.get('content-type')).toBe('image/webp');
    expect(thumb.headers.get('x-content-type-options')).toBe('nosniff');
    expect((await sharp(Buffer.from(await thumb.arrayBuffer())).metadata()).width).toBe(400);

    const list = await member.json(`/api/uploads?treeId=${treeId}`, 'GET');
    expect(list.body.items.map((p: { id: string }) => p.id)).toEqual([photo.id]);
    const page = await (await member.get(`/trees/${treeId}`)).text();
    expect(page).toContain(photo.thumbUrl.replace('&', '&amp;'));
  });

  it('another member, and the anonymous, cannot see, list, add or remove the photos of a tree', async () => {
    const { body } = await upload(member, { treeId }, await pngPhoto(), 'p.png', 'image/png');
    const id = body.photo.id;
    expect((await other.get(`/api/uploads/${id}`)).status).toBe(404);
    expect((await other.get(`/api/uploads/${id}?size=thumb`)).status).toBe(404);
    expect((await other.json(`/api/uploads?treeId=${treeId}`, 'GET')).status).toBe(404);
    expect((await other.json(`/api/uploads/${id}`, 'DELETE')).status).toBe(404);
    expect((await upload(other, { treeId }, await pngPhoto(), 'p.png', 'image/png')).status).toBe(404);
    const anon = new Client(base);
    expect((await anon.get(`/api/uploads/${id}`)).status).toBe(401);
    expect((await anon.json(`/api/uploads/${id}`, 'DELETE')).status).toBe(401);
    expect((await upload(anon, { treeId }, await pngPhoto(), 'p.png', 'image/png')).status).toBe(401);
    // Still there for the owner.
    expect((await member.get(`/api/uploads/${id}`)).status).toBe(200);
    expect((await member.json(`/api/uploads/${id}`, 'DELETE')).status).toBe(204);
    expect((await member.get(`/api/uploads/${id}`)).status).toBe(404);
  });

  for (const { label, make, name, type, status } of refusedUploads) {
    it(`refuses ${label} with ${status} and writes nothing`, async () => {
      const before = filesUnder(uploadsDir);
      const listBefore = (await member.json(`/api/uploads?treeId=${treeId}`, 'GET')).body.items.length;
      const res = await upload(member, { treeId }, await make(), name, type);
      expect(res.status).toBe(status);
      expect(res.body.error.fields.file[0]).toBeTruthy();
      expect(filesUnder(uploadsDir)).toEqual(before);
      for (const p of pathNameTargets) expect(fs.existsSync(p), p).toBe(false);
      expect((await member.json(`/api/uploads?treeId=${treeId}`, 'GET')).body.items.length).toBe(listBefore);
    });
  }

  it('refuses a request without a file, without an item, or not multipart', async () => {
    const form = new FormData();
    form.append('treeId', treeId);
    expect((await member.request('/api/uploads', { method: 'POST', body: form })).status).toBe(400);
    expect((await upload(member, {}, await pngPhoto(), 'p.png', 'image/png')).status).toBe(400);
    expect((await upload(member, { treeId, answerId: 'abcdefgh' }, await pngPhoto(), 'p.png', 'image/png')).status).toBe(400);
    expect((await member.json('/api/uploads', 'POST', { treeId })).status).toBe(415);
    expect((await upload(member, { treeId: 'nosuchtree123456' }, await pngPhoto(), 'p.png', 'image/png')).status).toBe(404);
  });

  it('takes up to six photos per tree and refuses the seventh with 409', async () => {
    const id = await newTree(member, 'Six photos');
    for (let i = 0; i < 6; i++) expect((await upload(member, { treeId: id }, await pngPhoto(50 + i, 40), `p${i}.png`, 'image/png')).status).toBe(201);
    const before = filesUnder(uploadsDir);
    const seventh = await upload(member, { treeId: id }, await pngPhoto(), 'p7.png', 'image/png');
    expect(seventh.status).toBe(409);
    expect(filesUnder(uploadsDir)).toEqual(before);
  });

  it('deleting a tree removes its photos and their files', async () => {
    const id = await newTree(member, 'Short-lived');
    const { body } = await upload(member, { treeId: id }, await pngPhoto(), 'p.png', 'image/png');
    const before = filesUnder(uploadsDir).length;
    expect((await member.json(`/api/trees/${id}`, 'DELETE')).status).toBe(204);
    expect(filesUnder(uploadsDir).length).toBe(before - 2);
    expect((await member.get(`/api/uploads/${body.photo.id}`)).status).toBe(404);
  });

  it("answer photos follow the answer: club members see a shared answer's photos, only the asker adds or removes", async () => {
    const shared = 'demoAnsWeirScots1'; // seeded: the demo member's answer, shared with the club
    const up = await upload(member, { answerId: shared }, await jpegPhoto(), 'a.jpg', 'image/jpeg');
    expect(up.status).toBe(201);
    const id = up.body.photo.id;
    expect((await other.get(`/api/uploads/${id}`)).status).toBe(200);
    const seen = await other.json(`/api/uploads?answerId=${shared}`, 'GET');
    expect(seen.body.items).toEqual([expect.objectContaining({ id, mine: false })]);
    expect((await upload(other, { answerId: shared }, await jpegPhoto(), 'b.jpg', 'image/jpeg')).status).toBe(403);
    expect((await other.json(`/api/uploads/${id}`, 'DELETE')).status).toBe(403);

    const saved = await member.json('/api/answers', 'POST', {
      species: 'pinus-mugo',
      branching: 'secondary',
      date: '2026-06-01',
      hemisphere: 'north',
      shoot: 'needles-hardened',
      health: 'strong',
      backBuds: true,
    });
    expect(saved.status).toBe(201);
    const privateId = saved.body.id;
    const p = await upload(member, { answerId: privateId }, await pngPhoto(), 'c.png', 'image/png');
    expect(p.status).toBe(201);
    expect((await other.get(`/api/uploads/${p.body.photo.id}`)).status).toBe(404);
    expect((await other.json(`/api/uploads?answerId=${privateId}`, 'GET')).status).toBe(404);
    expect((await upload(other, { answerId: privateId }, await pngPhoto(), 'd.png', 'image/png')).status).toBe(404);
    expect((await member.json(`/api/uploads/${id}`, 'DELETE')).status).toBe(204);
  });
});
