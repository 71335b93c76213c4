import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startApp, type RunningApp } from '../../support/app-server';
import { Client, signedIn } from '../../support/http-client';

// Sign-in links: the answer is the same for a member and a stranger, and the requests are
// limited per address and per client (whatever X-Forwarded-For claims). Its own server, so the
// per-client limit it trips does not touch the rest of the suite.
let app: RunningApp;
beforeAll(async () => {
  app = await startApp();
}, 120_000);
afterAll(async () => app?.stop());

const PER_EMAIL = 3; // app/api/auth/[...nextauth]/route.ts
const PER_IP = 30;

async function askLink(email: string, headers: Record<string, string> = {}) {
  const c = new Client(app.url);
  const csrfToken = await c.csrf();
  const res = await c.request('/api/auth/signin/email', {
    method: 'POST',
    headers: { 'content-type': 'application/x-www-form-urlencoded', ...headers },
    body: new URLSearchParams({ email, csrfToken, json: 'true' }).toString(),
  });
  const body = (await res.json().catch(() => ({}))) as { url?: string };
  return { status: res.status, url: body.url };
}

async function mailsTo(email: string) {
  const admin = await signedIn(app.url, 'admin@candlewise.test');
  const items = (await admin.json('/api/outbox?limit=100', 'GET')).body.items as { to: string[] }[];
  return items.filter((m) => m.to.includes(email)).length;
}

describe('sign-in links', () => {
  it('answer a member and a stranger alike', async () => {
    const member = await askLink('member@candlewise.test');
    const stranger = await askLink('nobody-at-all@candlewise.test');
    expect(member.status).toBe(200);
    expect(stranger).toEqual(member);
  });

  it(`stop after ${PER_EMAIL} requests for one address, in any spelling`, async () => {
    const email = 'editor@candlewise.test';
    const before = await mailsTo(email);
    const spellings = [email, email.toUpperCase(), ` ${email} `];
    for (let i = 0; i < PER_EMAIL; i++) expect((await askLink(spellings[i % 3], { 'x-forwarded-for': `203.0.113.${i}` })).status).toBe(200);
    for (let i = 0; i < 3; i++) expect((await askLink(spellings[i], { 'x-forwarded-for': `198.51.100.${i}` })).status).toBe(429);
    // The queued sends arrive; the refused ones never do.
    await new Promise((r) => setTimeout(r, 1500));
    expect(await mailsTo(email)).toBe(before + PER_EMAIL);
  });

  it(`stop after ${PER_IP} requests from one client, whatever it claims to be`, async () => {
    let refused = 0;
    for (let i = 0; i < PER_IP + 2; i++) {
      const r = await askLink(`someone-${i}@candlewise.test`, { 'x-forwarded-for': `192.0.2.${i}`, 'x-real-ip': `192.0.2.${i}` });
      if (r.status === 429) refused++;
    }
    // The earlier tests of this file used a few of this client's requests already.
    expect(refused).toBeGreaterThanOrEqual(2);
    expect((await askLink('librarian@candlewise.test')).status).toBe(429);
  });
});
