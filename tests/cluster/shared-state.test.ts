import { describe, expect, it } from 'vitest';
import { Client, DEMO_PASSWORD, signedIn } from '../support/http-client';
import { Fixtures, type Account } from '../integration/security/fixtures';
import { A, B, sameBrowserOn } from './helpers';

// What two processes on one database must agree on: the sign-in limits, and the caches a write
// through one process makes stale in the other (accounts, published species).
const fa = new Fixtures(A);

const MAX_PER_EMAIL = 10; // lib/auth/rate-limit.ts

async function failOn(base: string, email: string, times: number) {
  const c = new Client(base);
  for (let i = 0; i < times; i++) {
    const r = await c.signIn(email, 'wrong-password-1');
    expect(r.ok).toBe(false);
  }
}

/** A few reads at once, three times over, so the account is surely cached in that process. */
async function warm(c: Client, paths: string[]) {
  for (let round = 0; round < 3; round++) {
    const statuses = await Promise.all(paths.flatMap((p) => [p, p]).map(async (p) => (await c.json(p, 'GET')).status));
    expect(statuses.every((s) => s === 200)).toBe(true);
  }
}

describe('the sign-in lockout over two processes', () => {
  it('one failure short of the limit, split over A and B, still lets the right password in', async () => {
    const acc = await fa.newMember('lock-short');
    await failOn(A, acc.email, MAX_PER_EMAIL / 2);
    await failOn(B, acc.email, MAX_PER_EMAIL / 2 - 1);
    expect((await new Client(B).signIn(acc.email, acc.password)).ok).toBe(true);
  });

  it('five failures through A and five through B lock the account on both', async () => {
    const acc = await fa.newMember('lock-split');
    await failOn(A, acc.email, MAX_PER_EMAIL / 2);
    await failOn(B, acc.email, MAX_PER_EMAIL / 2);
    for (const base of [A, B]) {
      const right = await new Client(base).signIn(acc.email, acc.password);
      expect(right.ok, base).toBe(false);
      expect(right.status, base).toBe(429);
    }
    // The demo accounts are not affected.
    expect((await new Client(B).signIn('member2@candlewise.test', DEMO_PASSWORD)).ok).toBe(true);
  });
});

describe('an account changed through A, on the very next request to B', () => {
  async function adminAccount(prefix: string): Promise<Account> {
    const acc = await fa.newMember(prefix);
    expect((await (await fa.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { role: 'admin' })).status).toBe(200);
    expect((await acc.client.signIn(acc.email, acc.password)).ok).toBe(true);
    return acc;
  }

  it('a role change through A: B refuses the old admin session at once', async () => {
    const acc = await adminAccount('cl-demote');
    const onB = sameBrowserOn(acc.client, B);
    await warm(onB, ['/api/me', '/api/users', '/api/outbox']);
    expect((await (await fa.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { role: 'member' })).status).toBe(200);
    expect((await onB.json('/api/users', 'GET')).status).toBe(401);
    expect((await onB.json('/api/outbox', 'GET')).status).toBe(401);
    // Signed in again (through B), the account is a member there.
    const again = new Client(B);
    expect((await again.signIn(acc.email, acc.password)).ok).toBe(true);
    expect((await again.json('/api/me', 'GET')).body.user.role).toBe('member');
    expect((await again.json('/api/users', 'GET')).status).toBe(403);
  });

  it('a promotion through A is honoured by B at once', async () => {
    const acc = await fa.newMember('cl-promote');
    const onB = sameBrowserOn(acc.client, B);
    await warm(onB, ['/api/me']);
    expect((await onB.json('/api/users', 'GET')).status).toBe(403);
    expect((await (await fa.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { role: 'librarian' })).status).toBe(200);
    // The role change ends the session everywhere; the next sign-in, through A, carries the new role to B.
    expect((await onB.json('/api/me', 'GET')).status).toBe(401);
    expect((await acc.client.signIn(acc.email, acc.password)).ok).toBe(true);
    expect((await onB.json('/api/me', 'GET')).body.user.role).toBe('librarian');
  });

  it('a sign-out through A ends the session on B at once', async () => {
    const acc = await fa.newMember('cl-signout');
    const stolen = new Client(B);
    stolen.cookies = new Map(acc.client.cookies);
    await warm(stolen, ['/api/me', '/api/trees', '/api/answers']);
    expect((await acc.client.signOut()).status).toBe(200);
    expect((await stolen.json('/api/me', 'GET')).status).toBe(401);
    expect((await stolen.json('/api/trees', 'GET')).status).toBe(401);
  });
});

describe('a species published through A', () => {
  const ask = (species: string) => ({
    species,
    branching: 'tertiary',
    date: '2027-05-10',
    shoot: 'candle-extending',
    position: 'beyond-silhouette',
    health: 'average',
  });

  it('is in the wizard on B at once, and a later draft is not', async () => {
    const editor = await signedIn(A, 'editor@candlewise.test');
    const wizardB = new Client(B);
    const suffix = Date.now().toString(36).replace(/[0-9]/g, '');
    const slug = `pinus-duoprocessus${suffix}`;
    // B has looked for it (and remembers it as unknown) …
    for (let i = 0; i < 3; i++) expect((await wizardB.json('/api/wizard/evaluate', 'POST', ask(slug))).status).toBe(404);
    const offlineBefore = await wizardB.json('/api/wizard/offline-data', 'GET');
    expect(offlineBefore.body.species.map((s: { slug: string }) => s.slug)).not.toContain(slug);

    const from = (await editor.json('/api/species/pinus-sylvestris', 'GET')).body.species;
    // Names of its own, so the soak's searches for the Scots pine still find the Scots pine first.
    const record = {
      ...structuredClone(from.record),
      slug,
      botanicalName: `Pinus duoprocessus${suffix}`,
      commonNames: [`Two-process test pine ${suffix}`],
      synonyms: [],
    };
    const created = await editor.json('/api/species', 'POST', { record, body: '', summary: 'new', publish: true });
    expect(created.status).toBe(201);

    // … and sees it on the very next request.
    const first = await wizardB.json('/api/wizard/evaluate', 'POST', ask(slug));
    expect(first.status).toBe(200);
    expect(first.body.speciesRevision).toBe(1);
    const offline = await wizardB.json('/api/wizard/offline-data', 'GET');
    expect(offline.body.species.find((s: { slug: string }) => s.slug === slug)).toMatchObject({ revision: 1 });

    const pub = await editor.json(`/api/species/${slug}`, 'PATCH', { record, body: 'Second', summary: 'again', publish: true, baseRevision: 1 });
    expect(pub.status).toBe(200);
    expect((await wizardB.json('/api/wizard/evaluate', 'POST', ask(slug))).body.speciesRevision).toBe(2);
    const draft = await editor.json(`/api/species/${slug}`, 'PATCH', { record, body: 'Draft', summary: 'draft', publish: false, baseRevision: 2 });
    expect(draft.status).toBe(200);
    expect((await wizardB.json('/api/wizard/evaluate', 'POST', ask(slug))).body.speciesRevision).toBe(2);
  });
});
