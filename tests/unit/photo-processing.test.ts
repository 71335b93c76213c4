import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import sharp from 'sharp';
import { MAX_EDGE_PX, processPhoto, sniffPhotoType } from '@/lib/uploads/image';
import { LocalDirStorage } from '@/lib/storage/local';
import { isStorageKey, newStorageKey } from '@/lib/storage/types';
import { AppError } from '@/lib/errors';
import {
  gifJsPolyglot,
  htmlRenamedPng,
  hugePixelPng,
  jpegHtmlPolyglot,
  jpegPhoto,
  oversizeJpegLike,
  pngPhoto,
  svgWithScript,
  webpPhoto,
} from '../support/images';

async function rejection(p: Promise<unknown>): Promise<AppError> {
  try {
    await p;
  } catch (e) {
    expect(e).toBeInstanceOf(AppError);
    return e as AppError;
  }
  throw new Error('expected a rejection');
}

describe('photo checks', () => {
  it('knows the real type from the bytes', async () => {
    expect(await sniffPhotoType(await jpegPhoto())).toBe('image/jpeg');
    expect(await sniffPhotoType(await pngPhoto())).toBe('image/png');
    expect(await sniffPhotoType(await webpPhoto())).toBe('image/webp');
    expect(await sniffPhotoType(svgWithScript)).toBeNull();
    expect(await sniffPhotoType(htmlRenamedPng)).toBeNull();
    expect(await sniffPhotoType(gifJsPolyglot())).toBeNull();
  });

  it('refuses an SVG with a script, HTML named .png and a GIF/JS polyglot as unsupported types', async () => {
    for (const bad of [svgWithScript, htmlRenamedPng, gifJsPolyglot()]) {
      const e = await rejection(processPhoto(bad));
      expect(e.status).toBe(415);
      expect(e.fields?.file?.[0]).toMatch(/JPEG, PNG and WebP/);
    }
  });

  it('refuses a PNG whose header claims 20000 × 20000 pixels without decoding it', async () => {
    const bomb = hugePixelPng();
    expect(bomb.length).toBeLessThan(200_000);
    const e = await rejection(processPhoto(bomb));
    expect(e.status).toBe(422);
    expect(e.code).toBe('invalid:file_pixels');
    expect(e.message).toContain('20000 × 20000');
  });

  it('refuses more than 10 MB with 413 and an empty file with 422', async () => {
    expect((await rejection(processPhoto(oversizeJpegLike()))).status).toBe(413);
    expect((await rejection(processPhoto(Buffer.alloc(0)))).status).toBe(422);
  });

  it('refuses a damaged JPEG', async () => {
    const good = await jpegPhoto();
    const e = await rejection(processPhoto(good.subarray(0, 200)));
    expect(e.status).toBe(422);
  });

  it('re-encodes: GPS position and camera details are gone, a thumbnail is made', async () => {
    const input = await jpegPhoto(800, 600, { gps: true });
    const before = await sharp(input).metadata();
    expect(before.exif).toBeDefined();
    const out = await processPhoto(input);
    expect(out.mime).toBe('image/jpeg');
    const after = await sharp(out.data).metadata();
    expect(after.exif).toBeUndefined();
    expect(after.xmp).toBeUndefined();
    expect(out.data.includes(Buffer.from('TestCam'))).toBe(false);
    const thumb = await sharp(out.thumb).metadata();
    expect(thumb.format).toBe('webp');
    expect(Math.max(thumb.width!, thumb.height!)).toBe(400);
  });

  it('drops whatever trails the image in a JPEG/HTML polyglot', async () => {
    const out = await processPhoto(await jpegHtmlPolyglot());
    expect(out.data.includes(Buffer.from('<script>'))).toBe(false);
  });

  it('scales a large photo to the longest edge limit and keeps PNG and WebP as they are', async () => {
    const big = await processPhoto(await jpegPhoto(3000, 1500));
    expect([big.width, big.height]).toEqual([MAX_EDGE_PX, MAX_EDGE_PX / 2]);
    expect((await processPhoto(await pngPhoto())).mime).toBe('image/png');
    expect((await processPhoto(await webpPhoto())).mime).toBe('image/webp');
  });
});

describe('local storage', () => {
  const root = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-storage-'));
  afterAll(() => fs.rmSync(root, { recursive: true, force: true }));

  it('writes, reads and deletes under generated keys only', async () => {
    const s = new LocalDirStorage(root);
    const key = newStorageKey('photos', 'jpg');
    expect(isStorageKey(key)).toBe(true);
    await s.put(key, Buffer.from('abc'));
    expect((await s.get(key))?.toString()).toBe('abc');
    expect(fs.readdirSync(path.join(root, 'photos'))).toEqual([key.split('/')[1]]);
    await s.delete(key);
    expect(await s.get(key)).toBeNull();
  });

  it('refuses names a user could have chosen, traversal and NUL bytes', async () => {
    const s = new LocalDirStorage(root);
    for (const key of ['photos/../../etc/passwd.jpg', '../x.jpg', 'photos/holiday.jpg', 'photos/aaaaaaaaaaaaaaaaaaaaaa.jpg\0.png', '/etc/passwd']) {
      await expect(s.put(key, Buffer.from('x'))).rejects.toThrow(/did not generate/);
    }
  });
});
