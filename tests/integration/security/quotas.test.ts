import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startApp, type RunningApp } from '../../support/app-server';
import { Client } from '../../support/http-client';
import { evaluateBody, pngBytes, treeBody, uploadPhoto } from './bodies';
import { Fixtures } from './fixtures';

// Per-member caps on saved answers and photos, and a cap on sign-ups per client. Its own server
// with small caps (the defaults are thousands), so the caps are reached in a few requests.
let app: RunningApp;
let f: Fixtures;
const ANSWERS = 3;
const PHOTOS = 2;
const SIGNUPS = 4;
beforeAll(async () => {
  app = await startApp({ env: { ANSWER_QUOTA: String(ANSWERS), PHOTO_QUOTA: String(PHOTOS), SIGNUPS_PER_CLIENT_PER_HOUR: String(SIGNUPS) } });
  f = new Fixtures(app.url);
}, 120_000);
afterAll(async () => app?.stop());

describe('caps', () => {
  it(`a member keeps at most ${ANSWERS} saved answers`, async () => {
    const acc = await f.newMember('answers'); // sign-up 1
    for (let i = 0; i < ANSWERS; i++) expect((await acc.client.json('/api/answers', 'POST', await evaluateBody(f))).status).toBe(201);
    const over = await acc.client.json('/api/answers', 'POST', await evaluateBody(f));
    expect(over.status).toBe(403);
    expect(over.body.error.code).toBe('forbidden:quota');
    // Another member is not held by it.
    expect((await (await f.client('member')).json('/api/answers', 'POST', await evaluateBody(f))).status).toBe(201);
  });

  it(`a member keeps at most ${PHOTOS} photos, over all their trees`, async () => {
    const acc = await f.newMember('photos'); // sign-up 2
    const trees: string[] = [];
    for (let i = 0; i < 2; i++) trees.push((await acc.client.json('/api/trees', 'POST', await treeBody(f, `Quota pine ${i}`))).body.tree.id);
    for (let i = 0; i < PHOTOS; i++) expect((await uploadPhoto(acc.client, { treeId: trees[i % 2] }, await pngBytes())).status).toBe(201);
    const over = await uploadPhoto(acc.client, { treeId: trees[1] }, await pngBytes());
    expect(over.status).toBe(403);
    expect(over.body.error.fields).toHaveProperty('file');
  });

  it(`one client asks for at most ${SIGNUPS} sign-ups an hour, whatever it claims to be`, async () => {
    const statuses: number[] = [];
    for (let i = 0; i < SIGNUPS; i++) {
      const r = await new Client(app.url).json(
        '/api/users',
        'POST',
        { name: 'Quota', email: `quota-${i}-${Date.now()}@candlewise.test`, password: 'riverside-moss-and-stone' },
        { 'x-forwarded-for': `203.0.113.${i}` },
      );
      statuses.push(r.status);
    }
    // Two sign-ups went to the earlier tests of this file.
    expect(statuses).toEqual([202, 202, 429, 429]);
  });
});
