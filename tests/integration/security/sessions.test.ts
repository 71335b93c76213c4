import { describe, expect, inject, it } from 'vitest';
import { Client, Fixtures, type Account } from './fixtures';

// A session cookie grants only what the account may do now: after sign-out, a role change or a
// disable, the very next request with the old cookie is refused.
const base = inject('baseUrl');
const f = new Fixtures(base);

async function adminAccount(prefix: string): Promise<Account> {
  const acc = await f.newMember(prefix);
  const r = await (await f.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { role: 'admin' });
  expect(r.status).toBe(200);
  expect((await acc.client.signIn(acc.email, acc.password)).ok).toBe(true);
  return acc;
}

const copyOf = (c: Client) => {
  const copy = new Client(base);
  copy.cookies = new Map(c.cookies);
  return copy;
};

async function rights(c: Client) {
  return {
    me: (await c.json('/api/me', 'GET')).status,
    users: (await c.json('/api/users', 'GET')).status,
    outbox: (await c.json('/api/outbox', 'GET')).status,
    settings: (await c.json('/api/settings', 'PUT', { clubName: 'Riverside Pine Study Group', hemisphere: 'north', defaultLatitude: 45.5 })).status,
  };
}

describe('old session cookies', () => {
  it('stop working on the next request after sign-out, for every copy', async () => {
    const acc = await adminAccount('signout');
    const stolen = copyOf(acc.client);
    expect(await rights(stolen)).toEqual({ me: 200, users: 200, outbox: 200, settings: 200 });
    const out = await acc.client.signOut();
    expect(out.status).toBe(200);
    expect(await rights(stolen)).toEqual({ me: 401, users: 401, outbox: 401, settings: 401 });
    expect((await stolen.session()).user).toBeUndefined();
  });

  it('lose admin rights on the next request after a demotion', async () => {
    const acc = await adminAccount('demote');
    const old = copyOf(acc.client);
    expect((await rights(old)).users).toBe(200);
    expect((await (await f.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { role: 'member' })).status).toBe(200);
    expect(await rights(old)).toEqual({ me: 401, users: 401, outbox: 401, settings: 401 });
    // Signing in again gives the new, lower role.
    const again = new Client(base);
    expect((await again.signIn(acc.email, acc.password)).ok).toBe(true);
    expect(await rights(again)).toEqual({ me: 200, users: 403, outbox: 403, settings: 403 });
    expect((await again.session()).user?.role).toBe('member');
  });

  it('stop working on the next request after the account is disabled, and sign-in is refused', async () => {
    const acc = await adminAccount('disable');
    const old = copyOf(acc.client);
    expect((await (await f.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { disabled: true })).status).toBe(200);
    expect(await rights(old)).toEqual({ me: 401, users: 401, outbox: 401, settings: 401 });
    expect((await new Client(base).signIn(acc.email, acc.password)).ok).toBe(false);
  });

  it('a promotion does not hand old cookies the new rights silently', async () => {
    const acc = await f.newMember('promote');
    const old = copyOf(acc.client);
    expect((await rights(old)).users).toBe(403);
    expect((await (await f.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { role: 'admin' })).status).toBe(200);
    expect((await rights(old)).users).toBe(401);
  });

  it('a forged cookie value grants nothing', async () => {
    const c = new Client(base);
    c.cookies.set('next-auth.session-token', 'eyJhbGciOiJkaXIiLCJlbmMiOiJBMjU2R0NNIn0..forged.forged.forged');
    expect(await rights(c)).toEqual({ me: 401, users: 401, outbox: 401, settings: 401 });
  });
});

describe('e-mail sign-in links', () => {
  async function linkFor(email: string) {
    const admin = await f.client('admin');
    const newest = async () => (await admin.json('/api/outbox?limit=20', 'GET')).body.items.find((m: { to: string[] }) => m.to.includes(email));
    const before = (await newest())?.id ?? 0;
    const c = new Client(base);
    const csrfToken = await c.csrf();
    const res = await c.request('/api/auth/signin/email', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ email, csrfToken, json: 'true' }).toString(),
    });
    expect(res.status).toBe(200);
    for (let i = 0; i < 50; i++) {
      const m = await newest();
      if (m && m.id > before) return new URL((m.text as string).match(/https?:\/\/\S+/)![0]);
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error(`no link arrived for ${email}`);
  }

  const follow = async (link: URL) => {
    const c = new Client(base);
    const res = await c.get(link.pathname + link.search);
    return { location: res.headers.get('location') ?? '', user: (await c.session()).user };
  };

  it('sign in once; the second use is refused', async () => {
    const acc = await f.newMember('link-once');
    const link = await linkFor(acc.email);
    const first = await follow(link);
    expect(first.location).not.toContain('error');
    expect(first.user?.id).toBe(acc.id);
    const second = await follow(link);
    expect(second.location).toContain('error=Verification');
    expect(second.user).toBeUndefined();
  });

  it('a link sent before the account was disabled no longer signs in', async () => {
    const acc = await f.newMember('link-disabled');
    const link = await linkFor(acc.email);
    expect((await (await f.client('admin')).json(`/api/users/${acc.id}`, 'PATCH', { disabled: true })).status).toBe(200);
    const r = await follow(link);
    expect(r.user).toBeUndefined();
    expect(r.location).toContain('error');
  });
});
