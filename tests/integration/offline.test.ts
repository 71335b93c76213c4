import { describe, expect, inject, it } from 'vitest';
import { randomBytes } from 'node:crypto';
import { Client, signedIn } from '../support/http-client';

// What a phone that worked an answer out offline sends when it saves, and what the saved answer shows.
const base = inject('baseUrl');

const body = {
  species: 'pinus-sylvestris',
  branching: 'tertiary',
  date: '2027-05-10',
  shoot: 'candle-extending',
  position: 'beyond-silhouette',
  health: 'average',
};
const key = () => randomBytes(16).toString('hex');

describe('offline data for the phone', () => {
  it('serves every published species with its revision and the club settings, to anyone', async () => {
    const r = await new Client(base).json('/api/wizard/offline-data', 'GET');
    expect(r.status).toBe(200);
    expect(r.headers.get('content-type')).toMatch(/^application\/json/);
    expect(r.body.context).toEqual({ hemisphere: 'north', latitude: expect.any(Number), decandleOffsetDays: expect.any(Number) });
    const scots = r.body.species.find((s: { slug: string }) => s.slug === 'pinus-sylvestris');
    expect(scots).toMatchObject({ group: 'pine', needlesPerFascicle: 2, revision: expect.any(Number) });
    // The phone's answer from this copy is the server's answer.
    const server = await new Client(base).json('/api/wizard/evaluate', 'POST', body);
    expect(server.body.speciesRevision).toBe(scots.revision);
  });
});

describe('saving an answer worked out on the phone', () => {
  it('keeps and shows the phone answer beside the server one when they differ, once per key', async () => {
    const member = await signedIn(base, 'member@candlewise.test');
    const server = (await member.json('/api/wizard/evaluate', 'POST', body)).body;
    // A phone with an older copy of the species data that came to another answer.
    const phoneResult = {
      ...server,
      action: 'wait',
      headline: 'Wait: nothing to do now',
      speciesRevision: server.speciesRevision - 1,
      reasons: server.reasons.slice(0, 1),
    };
    const k = key();
    const first = await member.json('/api/answers', 'POST', { ...body, phoneResult }, { 'Idempotency-Key': k });
    expect(first.status).toBe(201);
    expect(first.body.phoneResult).toMatchObject({ action: 'wait', speciesRevision: server.speciesRevision - 1 });
    expect(first.body.action).toBe(server.action);
    const again = await member.json('/api/answers', 'POST', { ...body, phoneResult }, { 'Idempotency-Key': k });
    expect(again.status).toBe(200);
    expect(again.body.id).toBe(first.body.id);
    const list = await member.json(`/api/answers?limit=50`, 'GET');
    expect(list.body.items.filter((a: { id: string }) => a.id === first.body.id)).toHaveLength(1);

    const page = await member.get(first.body.url);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('The phone and Candlewise came to different answers');
    expect(html).toContain('data-testid="phone-answer"');
    expect(html).toContain(`species revision <!-- -->${server.speciesRevision - 1}`);
    expect(html).toContain(server.headline);
  });

  it('shows no comparison when the phone agreed with the server', async () => {
    const member = await signedIn(base, 'member@candlewise.test');
    const server = (await member.json('/api/wizard/evaluate', 'POST', body)).body;
    const saved = await member.json('/api/answers', 'POST', { ...body, phoneResult: server }, { 'Idempotency-Key': key() });
    expect(saved.status).toBe(201);
    expect(saved.body.phoneResult).toBeNull();
    const html = await (await member.get(saved.body.url)).text();
    expect(html).not.toContain('The phone and Candlewise came to different answers');
  });

  it('refuses a malformed phone result or key, naming the field, and saves nothing', async () => {
    const member = await signedIn(base, 'member@candlewise.test');
    const before = (await member.json('/api/answers?limit=50', 'GET')).body.items.length;
    const bad = await member.json('/api/answers', 'POST', { ...body, phoneResult: { action: 'dig-it-up' } }, { 'Idempotency-Key': key() });
    expect(bad.status).toBe(400);
    expect(JSON.stringify(bad.body.error.fields)).toContain('phoneResult');
    const badKey = await member.json('/api/answers', 'POST', body, { 'Idempotency-Key': 'short' });
    expect(badKey.status).toBe(400);
    expect(badKey.body.error.fields).toHaveProperty('Idempotency-Key');
    expect((await member.json('/api/answers?limit=50', 'GET')).body.items.length).toBe(before);
  });
});

describe('installable', () => {
  it('serves the manifest and the service worker with the right types', async () => {
    const anon = new Client(base);
    const m = await anon.get('/manifest.webmanifest');
    expect(m.status).toBe(200);
    expect(m.headers.get('content-type')).toMatch(/^application\/manifest\+json/);
    const sw = await anon.get('/serwist/sw.js');
    expect(sw.status).toBe(200);
    expect(sw.headers.get('content-type')).toMatch(/javascript/);
    expect(sw.headers.get('service-worker-allowed')).toBe('/');
    const src = await sw.text();
    expect(src).toContain('/api/wizard/offline-data');
  });
});
