import { beforeAll, describe, expect, inject, it } from 'vitest';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import zlib from 'node:zlib';
import sharp from 'sharp';
import { Fixtures, type Account } from './fixtures';
import { pngBytes, treeBody, uploadPhoto } from './bodies';

// Hostile uploads: each is refused with a 4xx and leaves nothing on disk — not under
// UPLOADS_DIR, not where a path in its name points.
const base = inject('baseUrl');
const uploadsDir = path.join(inject('dataDir'), 'uploads');
const f = new Fixtures(base);
let owner: Account;
let treeId: string;

function filesUnder(dir: string): string[] {
  if (!fs.existsSync(dir)) return [];
  return fs
    .readdirSync(dir, { recursive: true, withFileTypes: true })
    .filter((e) => e.isFile())
    .map((e) => path.join(e.parentPath, e.name))
    .sort();
}

function chunk(type: string, data: Buffer) {
  const len = Buffer.alloc(4);
  len.writeUInt32BE(data.length);
  const body = Buffer.concat([Buffer.from(type, 'ascii'), data]);
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(zlib.crc32(body) >>> 0);
  return Buffer.concat([len, body, crc]);
}

/** A well-formed PNG header claiming 20 000 × 20 000 pixels, with a few rows of real data. */
function hugeCanvasPng(width = 20_000, height = 20_000) {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 8; // bit depth
  ihdr[9] = 2; // RGB
  const rows = Buffer.alloc((1 + width * 3) * 4); // four rows of black; the rest is missing
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk('IHDR', ihdr),
    chunk('IDAT', zlib.deflateSync(rows)),
    chunk('IEND', Buffer.alloc(0)),
  ]);
}

const svgWithScript = Buffer.from(
  '<?xml version="1.0"?><svg xmlns="http://www.w3.org/2000/svg" width="10" height="10" onload="alert(1)"><script>alert(2)</script><rect width="10" height="10"/></svg>',
);
const htmlPage = Buffer.from('<!doctype html><html><body><script>alert(document.cookie)</script></body></html>');
// GIF header whose width/height bytes open a JS comment: a valid GIF start that is also script.
const gifJsPolyglot = Buffer.concat([
  Buffer.from('GIF89a/*', 'latin1'),
  Buffer.from([0xf7, 0x00, 0x00, 0x00, 0x00, 0x00, 0x2c, 0x00, 0x00, 0x00, 0x00, 0x01, 0x00, 0x01, 0x00, 0x00, 0x02, 0x02, 0x44, 0x01, 0x00, 0x3b]),
  Buffer.from('*/=alert(document.domain);//', 'latin1'),
]);

beforeAll(async () => {
  owner = await f.newMember('uploads');
  const t = await owner.client.json('/api/trees', 'POST', await treeBody(f, 'Upload target'));
  expect(t.status, JSON.stringify(t.body)).toBe(201);
  treeId = t.body.tree.id;
});

describe('hostile uploads', () => {
  const cases: { label: string; bytes: () => Promise<Buffer> | Buffer; filename: string; type: string; statuses: number[] }[] = [
    { label: 'SVG with a script', bytes: () => svgWithScript, filename: 'shoot.svg', type: 'image/svg+xml', statuses: [415] },
    { label: 'SVG with a script, named .png', bytes: () => svgWithScript, filename: 'shoot.png', type: 'image/png', statuses: [415] },
    { label: 'HTML renamed .png', bytes: () => htmlPage, filename: 'shoot.png', type: 'image/png', statuses: [415] },
    { label: 'GIF/JS polyglot', bytes: () => gifJsPolyglot, filename: 'shoot.gif', type: 'image/gif', statuses: [415] },
    { label: 'GIF/JS polyglot named .jpg', bytes: () => gifJsPolyglot, filename: 'shoot.jpg', type: 'image/jpeg', statuses: [415] },
    { label: '20 000 × 20 000 PNG', bytes: () => hugeCanvasPng(), filename: 'huge.png', type: 'image/png', statuses: [413, 422] },
    {
      label: 'oversize (11 MB) JPEG',
      bytes: async () =>
        Buffer.concat([
          await sharp({ create: { width: 8, height: 8, channels: 3, background: '#335533' } })
            .jpeg()
            .toBuffer(),
          Buffer.alloc(11 * 1024 * 1024, 7),
        ]),
      filename: 'big.jpg',
      type: 'image/jpeg',
      statuses: [413],
    },
    { label: 'path-traversal name', bytes: () => pngBytes(), filename: '../../../../../tmp/cw-evil-upload.png', type: 'image/png', statuses: [400, 422] },
    { label: 'Windows path-traversal name', bytes: () => pngBytes(), filename: '..\\..\\..\\cw-evil-upload.png', type: 'image/png', statuses: [400, 422] },
    { label: 'absolute-path name', bytes: () => pngBytes(), filename: '/etc/cw-evil-upload.png', type: 'image/png', statuses: [400, 422] },
    { label: 'NUL-byte name', bytes: () => pngBytes(), filename: 'shoot.png\u0000.html', type: 'image/png', statuses: [400, 422] },
  ];

  it.each(cases.map((c) => [c.label, c] as const))('refuses %s and writes nothing', async (_, c) => {
    const before = filesUnder(uploadsDir);
    const r = await uploadPhoto(owner.client, { treeId }, await c.bytes(), { filename: c.filename, type: c.type });
    expect(c.statuses, `${r.status} ${JSON.stringify(r.body)}`).toContain(r.status);
    expect(r.body?.error?.fields?.file ?? r.body?.error?.fields, 'the field at fault is named').toBeTruthy();
    expect(filesUnder(uploadsDir)).toEqual(before);
    for (const p of [path.join(os.tmpdir(), 'cw-evil-upload.png'), '/etc/cw-evil-upload.png', path.resolve(uploadsDir, '..', 'cw-evil-upload.png')]) {
      expect(fs.existsSync(p), p).toBe(false);
    }
  });

  it('a good photo is accepted (control), and what is stored is a re-encoded image, not the bytes sent', async () => {
    const before = filesUnder(uploadsDir);
    // A valid PNG with a script appended after its end: accepted, but the payload is not kept.
    const trailing = Buffer.concat([await pngBytes(), Buffer.from('<script>alert(1)</script>')]);
    const r = await uploadPhoto(owner.client, { treeId }, trailing, { filename: 'shoot.png' });
    expect(r.status, JSON.stringify(r.body)).toBe(201);
    const added = filesUnder(uploadsDir).filter((p) => !before.includes(p));
    expect(added.length).toBeGreaterThan(0);
    for (const p of added) {
      expect(p.startsWith(uploadsDir + path.sep)).toBe(true);
      expect(fs.readFileSync(p).includes('<script>')).toBe(false);
    }
    const served = await owner.client.get(`/api/uploads/${r.body.photo.id}`);
    expect(served.headers.get('content-type')).toMatch(/^image\/(png|webp|jpeg)$/);
    expect(served.headers.get('x-content-type-options')).toBe('nosniff');
    expect(Buffer.from(await served.arrayBuffer()).includes('<script>')).toBe(false);
  });
});
