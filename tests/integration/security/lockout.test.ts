import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { startApp, type RunningApp } from '../../support/app-server';
import { Client, DEMO_PASSWORD, signUp } from '../../support/http-client';

// The sign-in lockout holds however the credentials arrive: a form body, a JSON body (next-auth
// accepts both), an extra path segment after callback/credentials (next-auth routes on the first
// two segments only), and whatever X-Forwarded-For the client claims. Its own server, so the
// per-client limit it trips does not lock the rest of the suite out.

let app: RunningApp;
beforeAll(async () => {
  app = await startApp();
}, 120_000);
afterAll(async () => app?.stop());

const MAX_PER_EMAIL = 10; // lib/auth/rate-limit.ts
const MAX_PER_IP = 100;

type Shape = 'form' | 'json';
async function attempt(c: Client, opts: { email: string; password: string; shape: Shape; path?: string; headers?: Record<string, string> }) {
  const csrfToken = await c.csrf();
  const fields = { email: opts.email, password: opts.password, csrfToken, json: 'true' };
  const res = await c.request(opts.path ?? '/api/auth/callback/credentials', {
    method: 'POST',
    headers: {
      'content-type': opts.shape === 'json' ? 'application/json' : 'application/x-www-form-urlencoded',
      ...opts.headers,
    },
    body: opts.shape === 'json' ? JSON.stringify(fields) : new URLSearchParams(fields).toString(),
  });
  const data = (await res.json().catch(() => ({}))) as { url?: string };
  return { status: res.status, ok: res.ok && !!data.url && !data.url.includes('error=') };
}

async function newAccount(prefix: string) {
  const email = `${prefix}-${Date.now().toString(36)}@candlewise.test`;
  const password = 'riverside-moss-and-stone';
  await signUp(app.url, { name: 'Lockout Test', email, password });
  return { email, password };
}

const variants: { name: string; fail: { shape: Shape; path?: string }; then: { shape: Shape; path?: string } }[] = [
  { name: 'form failures, then a JSON body', fail: { shape: 'form' }, then: { shape: 'json' } },
  { name: 'JSON failures, then a JSON body', fail: { shape: 'json' }, then: { shape: 'json' } },
  { name: 'form failures, then an extra path segment', fail: { shape: 'form' }, then: { shape: 'form', path: '/api/auth/callback/credentials/again' } },
  { name: 'extra-segment JSON failures, then a plain form', fail: { shape: 'json', path: '/api/auth/callback/credentials/x/y' }, then: { shape: 'form' } },
];

describe('the sign-in lockout', () => {
  for (const v of variants) {
    it(`holds for ${v.name}`, async () => {
      const acc = await newAccount(v.fail.shape);
      const c = new Client(app.url);
      for (let i = 0; i < MAX_PER_EMAIL; i++) {
        // Another spelling of the same address counts against the same account.
        const email = i % 2 ? acc.email.toUpperCase() : ` ${acc.email} `;
        expect((await attempt(c, { email, password: 'wrong-password-1', ...v.fail })).ok).toBe(false);
      }
      const right = await attempt(new Client(app.url), { email: acc.email, password: acc.password, ...v.then });
      expect(right.ok).toBe(false);
      expect(right.status).toBe(429);
    });
  }

  it('keys the per-client limit on the socket, not on a claimed X-Forwarded-For', async () => {
    const c = new Client(app.url);
    for (let i = 0; i < MAX_PER_IP; i++) {
      const r = await attempt(c, {
        email: `nobody-${i}@candlewise.test`,
        password: 'wrong-password-1',
        shape: i % 2 ? 'json' : 'form',
        headers: { 'x-forwarded-for': `203.0.113.${i % 250}`, 'x-real-ip': `198.51.100.${i % 250}` },
      });
      expect(r.ok).toBe(false);
    }
    // A right password from the same socket, claiming yet another address, is still refused.
    const blocked = await attempt(new Client(app.url), {
      email: 'member@candlewise.test',
      password: DEMO_PASSWORD,
      shape: 'form',
      headers: { 'x-forwarded-for': '192.0.2.77' },
    });
    expect(blocked.status).toBe(429);
  });
});
