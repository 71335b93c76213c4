import sharp from 'sharp';
import type { Client, Fixtures } from './fixtures';

// Valid request bodies for the record and wizard routes, shared by the security suites.

/** A published species of the demo data. */
async function speciesSlug(f: Fixtures): Promise<string> {
  return f.once('species-slug', async () => {
    const r = await (await f.client('member')).json('/api/species?limit=5', 'GET');
    const slug = r.body?.items?.[0]?.slug;
    if (!slug) throw new Error(`no species in the demo data: ${r.status}`);
    return slug as string;
  });
}

/** A complete, valid POST /api/wizard/evaluate body (refinement of a hardened shoot). */
export async function evaluateBody(f: Fixtures) {
  return {
    species: await speciesSlug(f),
    branching: 'tertiary',
    date: '2026-06-15',
    shoot: 'candle-extending',
    position: 'at-silhouette',
    health: 'strong',
  };
}

export async function treeBody(f: Fixtures, name = 'Security test pine') {
  return {
    name,
    speciesSlug: await speciesSlug(f),
    stageNotes: '',
    containerShape: null,
    containerLengthCm: null,
    containerWidthCm: null,
    acquiredOn: null,
    collectedFromWild: false,
    collectedOn: null,
    notes: '',
  };
}

export async function pngBytes(width = 64, height = 48): Promise<Buffer> {
  return sharp({ create: { width, height, channels: 3, background: { r: 70, g: 120, b: 60 } } })
    .png()
    .toBuffer();
}

export async function uploadPhoto(
  client: Client,
  target: { treeId?: string; answerId?: string },
  bytes: Buffer | Uint8Array,
  opts: { filename?: string; type?: string; headers?: Record<string, string> } = {},
) {
  const form = new FormData();
  if (target.treeId) form.set('treeId', target.treeId);
  if (target.answerId) form.set('answerId', target.answerId);
  form.set('file', new Blob([new Uint8Array(bytes)], { type: opts.type ?? 'image/png' }), opts.filename ?? 'shoot.png');
  const res = await client.request('/api/uploads', { method: 'POST', body: form, headers: opts.headers });
  const text = await res.text();
  let body: any = null;
  try {
    body = text ? JSON.parse(text) : null;
  } catch {
    body = { raw: text.slice(0, 200) };
  }
  return { status: res.status, body };
}
