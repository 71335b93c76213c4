import { describe, expect, inject, it } from 'vitest';
import { Client, Fixtures, type Account } from './fixtures';
import { signedIn } from '../../support/http-client';

// The server keeps each session's account in memory (lib/auth/token-cache.ts) and the wizard
// keeps published species for a few seconds (lib/data/read-cache.ts). Each test first makes the
// cached copy (many reads, some at once), then writes, and checks that the very next request
// sees the write: on the API, on a page (server components read the session their own way) and
// on the header that every page shows.
const base = inject('baseUrl');
const f = new Fixtures(base);

const copyOf = (c: Client) => {
  const copy = new Client(base);
  copy.cookies = new Map(c.cookies);
  return copy;
};

/** Many reads, ten at a time, so the account is surely cached (and loaded concurrently). */
async function warm(c: Client, paths = ['/api/me', '/api/answers', '/api/trees']) {
  for (let round = 0; round < 3; round++) {
    const statuses = await Promise.all(
      Array.from({ length: 10 }, (_, i) => c.get(paths[i % paths.length]).then(async (r) => (await r.body?.cancel(), r.status))),
    );
    expect(statuses.every((s) => s === 200)).toBe(true);
  }
}

async function pageStatus(c: Client, path: string) {
  const r = await c.get(path);
  await r.body?.cancel();
  return { status: r.status, location: r.headers.get('location') ?? '' };
}

async function headerName(c: Client) {
  const html = await (await c.get('/')).text();
  return /data-testid="current-user"[^>]*>.*?<a[^>]*>([^<]*)<\/a>/s.exec(html)?.[1] ?? null;
}

async function adminAccount(prefix: string): Promise<Account> {
  const acc = await f.newMember(prefix);
  expect((await (await f.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { role: 'admin' })).status).toBe(200);
  expect((await acc.client.signIn(acc.email, acc.password)).ok).toBe(true);
  return acc;
}

describe('the in-memory account of a session', () => {
  it('is dropped at sign-out: the next API call, page and header see a signed-out visitor', async () => {
    const acc = await f.newMember('cache-signout');
    const stolen = copyOf(acc.client);
    await warm(stolen);
    expect((await pageStatus(stolen, '/answers')).status).toBe(200);
    expect(await headerName(stolen)).toBe('Security Test');
    expect((await acc.client.signOut()).status).toBe(200);
    expect((await stolen.json('/api/me', 'GET')).status).toBe(401);
    const page = await pageStatus(stolen, '/answers');
    expect([302, 303, 307]).toContain(page.status);
    expect(page.location).toContain('/sign-in');
    expect(await headerName(stolen)).toBeNull();
  });

  it('is dropped at a role change: a warm admin cookie loses the admin page and API at once', async () => {
    const acc = await adminAccount('cache-demote');
    const old = copyOf(acc.client);
    await warm(old, ['/api/me', '/api/users', '/api/outbox']);
    expect((await pageStatus(old, '/admin')).status).toBe(200);
    expect((await (await f.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { role: 'member' })).status).toBe(200);
    expect((await old.json('/api/users', 'GET')).status).toBe(401);
    expect([302, 303, 307]).toContain((await pageStatus(old, '/admin')).status);
    // A fresh sign-in is cached anew with the new role.
    const again = new Client(base);
    expect((await again.signIn(acc.email, acc.password)).ok).toBe(true);
    await warm(again, ['/api/me']);
    expect((await again.json('/api/users', 'GET')).status).toBe(403);
    expect((await pageStatus(again, '/admin')).status).toBe(403);
  });

  it('is dropped at a disable, while other requests with the cookie are in flight', async () => {
    const acc = await f.newMember('cache-disable');
    const old = copyOf(acc.client);
    await warm(old);
    let stop = false;
    const background = (async () => {
      const seen: number[] = [];
      while (!stop)
        seen.push(
          ...(await Promise.all(
            [old.get('/api/me'), old.get('/api/trees')].map(async (p) => {
              const r = await p;
              await r.body?.cancel();
              return r.status;
            }),
          )),
        );
      return seen;
    })();
    await new Promise((r) => setTimeout(r, 200));
    expect((await (await f.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { disabled: true })).status).toBe(200);
    // Every request that starts after the write is refused.
    const after = await Promise.all(Array.from({ length: 10 }, () => old.json('/api/me', 'GET')));
    expect(after.map((r) => r.status)).toEqual(Array(10).fill(401));
    stop = true;
    const seen = await background;
    expect(seen.every((s) => s === 200 || s === 401)).toBe(true);
  });

  it('follows a name change on the next page', async () => {
    const acc = await f.newMember('cache-name');
    await warm(acc.client);
    expect(await headerName(acc.client)).toBe('Security Test');
    expect((await acc.client.json('/api/me', 'PATCH', { name: 'Heron Willowby' })).status).toBe(200);
    expect(await headerName(acc.client)).toBe('Heron Willowby');
    expect((await acc.client.json('/api/me', 'GET')).body.user.name).toBe('Heron Willowby');
  });

  it('keeps one account from answering for another', async () => {
    const [a, b] = await Promise.all([f.newMember('cache-a'), f.newMember('cache-b')]);
    await Promise.all([warm(a.client), warm(b.client)]);
    const [ma, mb] = await Promise.all([a.client.json('/api/me', 'GET'), b.client.json('/api/me', 'GET')]);
    expect(ma.body.user.email).toBe(a.email);
    expect(mb.body.user.email).toBe(b.email);
    await b.client.signOut();
    expect((await a.client.json('/api/me', 'GET')).status).toBe(200);
    expect((await b.client.json('/api/me', 'GET')).status).toBe(401);
  });
});

describe("the wizard's cached species", () => {
  const ask = (species: string) => ({
    species,
    branching: 'tertiary',
    date: '2027-05-10',
    shoot: 'candle-extending',
    position: 'beyond-silhouette',
    health: 'average',
  });

  it('follows a publish on the next evaluation, and ignores a draft', async () => {
    const editor = await signedIn(base, 'editor@candlewise.test');
    const anon = new Client(base);
    const suffix = Date.now().toString(36).replace(/[0-9]/g, '');
    const slug = `pinus-memoria${suffix}`;
    // An unknown species is remembered as unknown …
    for (let i = 0; i < 3; i++) expect((await anon.json('/api/wizard/evaluate', 'POST', ask(slug))).status).toBe(404);
    const from = (await anon.json('/api/species/pinus-sylvestris', 'GET')).body.species;
    // Names of its own, so searches for the Scots pine later in the run still find the Scots pine first.
    const record = {
      ...structuredClone(from.record),
      slug,
      botanicalName: `Pinus memoria${suffix}`,
      commonNames: [`Memoria test pine ${suffix}`],
      synonyms: [],
    };
    const created = await editor.json('/api/species', 'POST', { record, body: '', summary: 'new', publish: true });
    expect(created.status).toBe(201);
    // … until it is published.
    const first = await anon.json('/api/wizard/evaluate', 'POST', ask(slug));
    expect(first.status).toBe(200);
    expect(first.body.speciesRevision).toBe(1);
    const pub = await editor.json(`/api/species/${slug}`, 'PATCH', { record, body: 'Second', summary: 'again', publish: true, baseRevision: 1 });
    expect(pub.status).toBe(200);
    expect((await anon.json('/api/wizard/evaluate', 'POST', ask(slug))).body.speciesRevision).toBe(2);
    const draft = await editor.json(`/api/species/${slug}`, 'PATCH', { record, body: 'Draft', summary: 'draft', publish: false, baseRevision: 2 });
    expect(draft.status).toBe(200);
    expect((await anon.json('/api/wizard/evaluate', 'POST', ask(slug))).body.speciesRevision).toBe(2);
  });
});
