import { describe, expect, inject, it } from 'vitest';
import { ACTORS, Client, demoEmail, DEMO_PASSWORD, Fixtures, type Actor } from './fixtures';
import { isMutating, routeMatrix, sendRow, statusOk, type RouteRow } from './route-matrix';
import { mailsTo } from '../../support/http-client';

// Cross-site request forgery: every mutating route, sent by a signed-in actor who is allowed to
// make it, but from another site. Browsers attach the victim's cookies to such requests (a
// SameSite=Lax cookie still rides on top-level POSTs in some browsers and on same-site
// subdomains), so the server itself must refuse them.
const base = inject('baseUrl');
const f = new Fixtures(base);

const EVIL = 'https://evil.example';
const appRows = routeMatrix.filter((r) => isMutating(r) && r.kind !== 'auth');

/** The actor that gets furthest with a row: the first one allowed to make it. */
function allowedActor(row: RouteRow): Actor {
  // A route nobody may use with the matrix's body (the unsubscribe link without a real token)
  // is still sent cross-site: the origin check comes before anything else.
  return ACTORS.find((x) => [200, 201, 202, 204].some((s) => statusOk(row.expect[x], s))) ?? 'anonymous';
}

async function bodyText(res: Response) {
  const t = await res.text();
  try {
    return JSON.parse(t) as { error?: { code?: string } };
  } catch {
    return { raw: t.slice(0, 120) } as { error?: { code?: string } };
  }
}

describe('cross-site writes', () => {
  it('has mutating rows to check', () => {
    expect(appRows.length).toBeGreaterThan(0);
  });

  it.each(appRows.map((r) => [r.route, r] as const))('%s refuses a foreign Origin, Origin: null and a cross-site text/plain body', async (_, row) => {
    const actor = allowedActor(row);
    const attempts: { label: string; headers: Record<string, string>; ok: number[] }[] = [
      { label: 'Origin: https://evil.example', headers: { origin: EVIL, 'sec-fetch-site': 'cross-site' }, ok: [403] },
      { label: 'Origin: https://evil.example (no fetch metadata)', headers: { origin: EVIL }, ok: [403] },
      { label: 'Origin: null', headers: { origin: 'null' }, ok: [403] },
    ];
    if (row.body === 'json') {
      // What an HTML form or a no-preflight fetch from another site can send: text/plain.
      attempts.push(
        {
          label: 'text/plain JSON, cross-site',
          headers: { 'content-type': 'text/plain;charset=UTF-8', origin: EVIL, 'sec-fetch-site': 'cross-site' },
          ok: [403, 415],
        },
        {
          label: 'text/plain JSON, fetch metadata only',
          headers: { 'content-type': 'text/plain;charset=UTF-8', 'sec-fetch-site': 'cross-site' },
          ok: [403, 415],
        },
        // Without Origin this is no browser's request, but it must still not be taken as JSON.
        { label: 'text/plain JSON, no Origin', headers: { 'content-type': 'text/plain;charset=UTF-8' }, ok: [400, 415] },
      );
    }
    const failures: string[] = [];
    for (const a of attempts) {
      const res = await sendRow(f, row, actor, a.headers);
      const body = await bodyText(res);
      if (!a.ok.includes(res.status)) failures.push(`${a.label} as ${actor}: got ${res.status} ${JSON.stringify(body).slice(0, 120)}`);
      else if (res.status === 403 && body.error?.code !== 'forbidden:origin') failures.push(`${a.label}: 403 but code ${body.error?.code}`);
    }
    // The same request from our own origin goes through: the refusals above are about the origin.
    const same = await sendRow(f, row, actor, { origin: base, 'sec-fetch-site': 'same-origin' });
    if (!statusOk(row.expect[actor], same.status)) failures.push(`same-origin as ${actor}: got ${same.status}, want ${row.expect[actor]}`);
    await same.body?.cancel().catch(() => {});
    expect(failures).toEqual([]);
  });

  it('a forged settings change leaves the settings as they were', async () => {
    const admin = await f.client('admin');
    const before = (await admin.json('/api/settings', 'GET')).body.settings;
    const evil = { clubName: 'Taken over', hemisphere: before.hemisphere === 'north' ? 'south' : 'north', defaultLatitude: -12 };
    const forged: Record<string, string>[] = [{ origin: EVIL }, { origin: 'null' }, { 'sec-fetch-site': 'cross-site' }];
    for (const headers of forged) {
      await admin.json('/api/settings', 'PUT', evil, headers);
    }
    await admin.request('/api/settings', { method: 'PUT', headers: { 'content-type': 'text/plain', origin: EVIL }, body: JSON.stringify(evil) });
    await admin.request('/api/settings', { method: 'PUT', headers: { 'content-type': 'text/plain' }, body: JSON.stringify(evil) });
    expect((await admin.json('/api/settings', 'GET')).body.settings).toEqual(before);
  });
});

describe('cross-site requests to the sign-in endpoints', () => {
  // next-auth guards its own POSTs with a double-submit token the other site cannot read.
  it('a forged sign-out (no token) leaves the session signed in', async () => {
    const victim = await f.freshClient('member');
    const res = await victim.request('/api/auth/signout', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', origin: EVIL, 'sec-fetch-site': 'cross-site' },
      body: new URLSearchParams({ json: 'true' }).toString(),
    });
    await res.body?.cancel();
    expect((await victim.json('/api/me', 'GET')).status).toBe(200);
  });

  it('a forged sign-in (login CSRF, no token) does not sign the visitor in', async () => {
    const visitor = new Client(base);
    await visitor.get('/api/auth/csrf'); // the visitor has a token cookie of their own, not the attacker's
    const res = await visitor.request('/api/auth/callback/credentials', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', origin: EVIL, 'sec-fetch-site': 'cross-site' },
      body: new URLSearchParams({ email: demoEmail.member, password: DEMO_PASSWORD, json: 'true' }).toString(),
    });
    await res.body?.cancel();
    expect((await visitor.session()).user).toBeUndefined();
    expect((await visitor.json('/api/me', 'GET')).status).toBe(401);
  });

  it('a forged e-mail link request (no token) sends no mail', async () => {
    // An account of its own, so mail other files send at the same time cannot be counted here.
    const { email } = await f.newMember('csrf-link');
    const count = async () => (await mailsTo(base, email)).length;
    const before = await count();
    const res = await new Client(base).request('/api/auth/signin/email', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', origin: EVIL, 'sec-fetch-site': 'cross-site' },
      body: new URLSearchParams({ email, json: 'true' }).toString(),
    });
    await res.body?.cancel();
    await new Promise((r) => setTimeout(r, 500));
    expect(await count()).toBe(before);

    // Control: the same request with the visitor's own token does send the link.
    const own = new Client(base);
    const csrfToken = await own.csrf();
    const ok = await own.request('/api/auth/signin/email', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ email, csrfToken, json: 'true' }).toString(),
    });
    await ok.body?.cancel();
    for (let i = 0; i < 50 && (await count()) === before; i++) await new Promise((r) => setTimeout(r, 100));
    expect(await count()).toBeGreaterThan(before);
  });
});
