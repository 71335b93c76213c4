import { describe, expect, inject, it } from 'vitest';
import { Client, confirmToken, mailsTo, signedIn, signUp, waitForMail } from '../support/http-client';

const base = inject('baseUrl');

describe('health', () => {
  it('reports ok and database reachability', async () => {
    const res = await fetch(`${base}/api/health`);
    expect(res.status).toBe(200);
    const body = await res.json();
    expect(body.ok).toBe(true);
    expect(body.database.ok).toBe(true);
    expect(body.database.kind).toBe(inject('dbKind'));
  });

  it("reports the cache-invalidation listener: live on PostgreSQL, off on PGlite's one process", async () => {
    const want = inject('dbKind') === 'postgres' ? 'live' : 'off';
    let got: unknown;
    for (let i = 0; i < 100 && got !== want; i++) {
      got = ((await (await fetch(`${base}/api/health`)).json()) as { invalidation: unknown }).invalidation;
      if (got !== want) await new Promise((r) => setTimeout(r, 100));
    }
    expect(got).toBe(want);
  });
});

describe('sign-in with password', () => {
  it('signs in each demo role and reports the role in the session', async () => {
    for (const [email, role] of [
      ['member@candlewise.test', 'member'],
      ['editor@candlewise.test', 'editor'],
      ['librarian@candlewise.test', 'librarian'],
      ['admin@candlewise.test', 'admin'],
    ] as const) {
      const c = await signedIn(base, email);
      const s = await c.session();
      expect(s.user?.role).toBe(role);
    }
  });

  it('gives the same answer for a wrong password and an unknown e-mail', async () => {
    const wrongPw = await new Client(base).signIn('member2@candlewise.test', 'not-the-password');
    const unknown = await new Client(base).signIn('nobody@candlewise.test', 'not-the-password');
    expect(wrongPw.ok).toBe(false);
    expect(unknown.ok).toBe(false);
    expect(wrongPw.status).toBe(unknown.status);
    expect(new URL(wrongPw.url!).searchParams.get('error')).toBe(new URL(unknown.url!).searchParams.get('error'));
  });

  it('rate limits repeated failures for one address with 429', async () => {
    const email = 'rate-limit-target@candlewise.test';
    const statuses: number[] = [];
    for (let i = 0; i < 12; i++) statuses.push((await new Client(base).signIn(email, `wrong-${i}`)).status);
    expect(statuses.slice(0, 10).every((s) => s !== 429)).toBe(true);
    expect(statuses.slice(10)).toEqual([429, 429]);
  });
});

describe('sign-up', () => {
  it('refuses a common password, then makes the account only when the mailed link is opened', async () => {
    const c = new Client(base);
    const weak = await c.json('/api/users', 'POST', { name: 'Ivy', email: 'ivy@candlewise.test', password: 'password123' });
    expect(weak.status).toBe(422);
    expect(weak.body.error.fields.password).toBeDefined();
    const ok = await c.json('/api/users', 'POST', { name: 'Ivy', email: 'IVY@candlewise.test', password: 'a-long-riverside-phrase' });
    expect(ok.status).toBe(202);
    expect(ok.body).toEqual({ status: 'pending', email: 'ivy@candlewise.test', message: expect.stringContaining('ivy@candlewise.test') });
    // No account yet: the password does not sign in until the owner of the address confirms.
    expect((await c.signIn('ivy@candlewise.test', 'a-long-riverside-phrase')).ok).toBe(false);
    const mail = await waitForMail(base, 'ivy@candlewise.test', /^Confirm your Candlewise account$/);
    const token = confirmToken(mail);
    const confirmed = await c.json('/api/users/confirm', 'POST', { token });
    expect(confirmed.status).toBe(200);
    expect(confirmed.body).toEqual({ email: 'ivy@candlewise.test', created: true });
    // The link works once.
    const again = await c.json('/api/users/confirm', 'POST', { token });
    expect(again.status).toBe(404);
    expect(again.body.error.code).toBe('not_found:sign-up');
    expect((await c.signIn('ivy@candlewise.test', 'a-long-riverside-phrase')).ok).toBe(true);
    expect((await c.session()).user?.role).toBe('member');
  });

  it('answers a new address and one with an account alike, and tells the account owner by e-mail', async () => {
    const fresh = `newcomer-${Date.now()}@candlewise.test`;
    const taken = 'member2@candlewise.test';
    const before = (await mailsTo(base, taken)).length;
    const a = await new Client(base).json('/api/users', 'POST', { name: 'Rowan', email: fresh, password: 'moss-on-the-north-side' });
    const b = await new Client(base).json('/api/users', 'POST', { name: 'Rowan', email: taken, password: 'moss-on-the-north-side' });
    expect(a.status).toBe(202);
    expect(b.status).toBe(a.status);
    // The same words, but for the address itself.
    expect(JSON.stringify(b.body).replaceAll(taken, 'X')).toBe(JSON.stringify(a.body).replaceAll(fresh, 'X'));
    expect([...b.headers.keys()].sort()).toEqual([...a.headers.keys()].sort());
    const notice = await waitForMail(base, taken, /^You already have a Candlewise account$/);
    expect(notice.text).toContain(`/sign-in?email=${encodeURIComponent(taken)}`);
    expect(notice.text).not.toMatch(/sign-up\/confirm/);
    expect((await mailsTo(base, taken)).length).toBe(before + 1);
    // The account and its password are untouched.
    expect((await new Client(base).signIn(taken, 'moss-on-the-north-side')).ok).toBe(false);
    expect((await new Client(base).signIn(taken)).ok).toBe(true);
    await waitForMail(base, fresh, /^Confirm your Candlewise account$/);
  });

  it('keeps each link to its own password: a later sign-up for the address does not change an earlier link', async () => {
    const email = `twice-${Date.now()}@candlewise.test`;
    await new Client(base).json('/api/users', 'POST', { name: 'First', email, password: 'first-cedar-phrase' });
    const first = confirmToken(await waitForMail(base, email, /^Confirm/));
    await new Client(base).json('/api/users', 'POST', { name: 'Second', email, password: 'second-cedar-phrase' });
    const deadline = Date.now() + 10_000;
    let second = first;
    while (second === first && Date.now() < deadline) {
      second = confirmToken((await mailsTo(base, email)).find((m) => /^Confirm/.test(m.subject))!);
      if (second === first) await new Promise((r) => setTimeout(r, 150));
    }
    expect(second).not.toBe(first);
    expect((await new Client(base).json('/api/users/confirm', 'POST', { token: first })).status).toBe(200);
    // Confirming one ends every other link of the address.
    expect((await new Client(base).json('/api/users/confirm', 'POST', { token: second })).status).toBe(404);
    expect((await new Client(base).signIn(email, 'first-cedar-phrase')).ok).toBe(true);
    expect((await new Client(base).signIn(email, 'second-cedar-phrase')).ok).toBe(false);
  });

  it('refuses a confirmation without a token with 422 naming the field', async () => {
    const r = await new Client(base).json('/api/users/confirm', 'POST', {});
    expect(r.status).toBe(422);
    expect(r.body.error.fields.token).toBeDefined();
  });

  it('rejects malformed JSON with 400 and a non-JSON body with 415', async () => {
    const bad = await fetch(`${base}/api/users`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"name":' });
    expect(bad.status).toBe(400);
    expect((await bad.json()).error.fields.body).toBeDefined();
    const plain = await fetch(`${base}/api/users`, { method: 'POST', headers: { 'content-type': 'text/plain' }, body: '{}' });
    expect(plain.status).toBe(415);
  });
});

describe('roles', () => {
  it('401 when not signed in, 403 for the wrong role, 200 for an admin', async () => {
    expect((await new Client(base).json('/api/users', 'GET')).status).toBe(401);
    const member = await signedIn(base, 'member@candlewise.test');
    expect((await member.json('/api/users', 'GET')).status).toBe(403);
    expect((await member.json('/api/outbox', 'GET')).status).toBe(403);
    expect((await member.json('/api/settings', 'PUT', { clubName: 'X', hemisphere: 'south', defaultLatitude: -30 })).status).toBe(403);
    const admin = await signedIn(base, 'admin@candlewise.test');
    const list = await admin.json('/api/users?q=candlewise.test&sort=email', 'GET');
    expect(list.status).toBe(200);
    expect(list.body.items.map((u: { email: string }) => u.email)).toContain('member@candlewise.test');
  });

  it('the admin page answers 403 to a member and redirects the anonymous to sign in', async () => {
    const anon = await new Client(base).get('/admin');
    expect([302, 303, 307]).toContain(anon.status);
    expect(anon.headers.get('location')).toContain('/sign-in');
    const member = await signedIn(base, 'member@candlewise.test');
    expect((await member.get('/admin')).status).toBe(403);
    const admin = await signedIn(base, 'admin@candlewise.test');
    expect((await admin.get('/admin')).status).toBe(200);
  });

  it('a role change and a disable take effect on the next request', async () => {
    const admin = await signedIn(base, 'admin@candlewise.test');
    const email = `promote-${Date.now()}@candlewise.test`;
    const { id, client: user } = await signUp(base, { name: 'Promoted', email, password: 'river-stones-and-moss' });
    expect((await user.json('/api/users', 'GET')).status).toBe(403);

    expect((await admin.json(`/api/users/${id}`, 'PATCH', { role: 'admin' })).status).toBe(200);
    // The old cookie no longer carries a current token version: the user signs in again and gets the new role.
    expect((await user.json('/api/users', 'GET')).status).toBe(401);
    expect((await user.signIn(email, 'river-stones-and-moss')).ok).toBe(true);
    expect((await user.json('/api/users', 'GET')).status).toBe(200);

    expect((await admin.json(`/api/users/${id}`, 'PATCH', { disabled: true })).status).toBe(200);
    expect((await user.json('/api/me', 'GET')).status).toBe(401);
    expect((await user.signIn(email, 'river-stones-and-moss')).ok).toBe(false);
  });

  it('sign-out ends the session even for a copied cookie', async () => {
    const c = await signedIn(base, 'member2@candlewise.test');
    const copy = new Client(base);
    copy.cookies = new Map(c.cookies);
    expect((await copy.json('/api/me', 'GET')).status).toBe(200);
    await c.signOut();
    expect((await copy.json('/api/me', 'GET')).status).toBe(401);
  });

  it('validates the admin patch and the settings body', async () => {
    const admin = await signedIn(base, 'admin@candlewise.test');
    // A malformed id names nobody: 404 before the body is looked at; a well-formed unknown one is
    // validated first (422), then not found (404).
    expect((await admin.json('/api/users/nope', 'PATCH', { role: 'emperor' })).status).toBe(404);
    const unknown = '00000000-0000-4000-8000-000000000000';
    expect((await admin.json(`/api/users/${unknown}`, 'PATCH', { role: 'emperor' })).status).toBe(422);
    expect((await admin.json(`/api/users/${unknown}`, 'PATCH', { role: 'editor' })).status).toBe(404);
    const bad = await admin.json('/api/settings', 'PUT', { clubName: '', hemisphere: 'east', defaultLatitude: 120 });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['clubName', 'defaultLatitude', 'hemisphere']);
  });
});

describe('cross-site requests', () => {
  it('refuses foreign and null origins and cross-site fetches on mutating routes', async () => {
    const admin = await signedIn(base, 'admin@candlewise.test');
    const body = { clubName: 'Evil club', hemisphere: 'south', defaultLatitude: 0 };
    const attempts: Record<string, string>[] = [{ origin: 'https://evil.example' }, { origin: 'null' }, { 'sec-fetch-site': 'cross-site' }];
    for (const headers of attempts) {
      const r = await admin.json('/api/settings', 'PUT', body, headers);
      expect(r.status).toBe(403);
      expect(r.body.error.code).toBe('forbidden:origin');
    }
    const same = await admin.json(
      '/api/settings',
      'PUT',
      { clubName: 'Riverside Pine Study Group', hemisphere: 'north', defaultLatitude: 45.5 },
      { origin: base },
    );
    expect(same.status).toBe(200);
  });
});

describe('e-mail sign-in link', () => {
  async function requestLink(email: string) {
    const c = new Client(base);
    const csrfToken = await c.csrf();
    const res = await c.request('/api/auth/signin/email', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ email, csrfToken, json: 'true', callbackUrl: '/' }).toString(),
    });
    expect(res.status).toBe(200);
  }

  async function latestLinkFor(email: string) {
    const admin = await signedIn(base, 'admin@candlewise.test');
    for (let i = 0; i < 40; i++) {
      const { body } = await admin.json('/api/outbox', 'GET');
      // The link is sent after the answer (queued), so wait for that mail, not any mail.
      const m = body.items.find((x: { to: string[]; text: string }) => x.to.includes(email) && x.text.includes('/api/auth/callback/email'));
      if (m) return (m.text as string).match(/https?:\/\/\S+/)![0];
      await new Promise((r) => setTimeout(r, 100));
    }
    throw new Error('no mail arrived');
  }

  it('arrives in the outbox, signs in once, and fails the second time', async () => {
    await requestLink('librarian@candlewise.test');
    const link = await latestLinkFor('librarian@candlewise.test');
    expect(link).toContain('/api/auth/callback/email');
    const c = new Client(base);
    const first = await c.get(new URL(link).pathname + new URL(link).search);
    expect(first.status).toBe(302);
    expect(first.headers.get('location')).not.toContain('error');
    expect((await c.session()).user?.role).toBe('librarian');
    const second = await new Client(base).get(new URL(link).pathname + new URL(link).search);
    expect(second.headers.get('location')).toContain('error=Verification');
  });

  it('sends nothing to an address with no account', async () => {
    await requestLink('stranger@candlewise.test');
    await new Promise((r) => setTimeout(r, 500));
    const admin = await signedIn(base, 'admin@candlewise.test');
    const { body } = await admin.json('/api/outbox', 'GET');
    expect(body.items.some((x: { to: string[] }) => x.to.includes('stranger@candlewise.test'))).toBe(false);
  });
});
