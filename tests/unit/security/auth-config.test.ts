import { afterEach, describe, expect, it, vi } from 'vitest';
import { memoryDb } from '../../support/memory-db';
import type { AuthOptions } from 'next-auth';
import { randomBytes } from 'node:crypto';
// next-auth does not export its core; it is the very code the route handler runs.
import { AuthHandler } from '../../../node_modules/next-auth/core/index.js';
import { DEMO_PASSWORD } from '@/db/seed';

// next-auth's own core, driven directly with our options and an in-memory database: the
// cookies it sets (HttpOnly, SameSite, Secure behind https) and the e-mail link's lifetime.
const sent: { to: string; url: string }[] = [];
vi.mock('@/lib/mail/templates', () => ({
  sendSignInLink: async (to: string, url: string) => void sent.push({ to, url }),
}));

memoryDb();
afterEach(() => vi.useRealTimers());

async function optionsFor(url: string): Promise<AuthOptions> {
  vi.resetModules();
  vi.stubEnv('NEXTAUTH_URL', url);
  vi.stubEnv('NEXTAUTH_SECRET', randomBytes(32).toString('base64url'));
  const { authOptions } = await import('@/lib/auth/options');
  vi.unstubAllEnvs();
  return authOptions;
}

type Cookie = { name: string; value: string; options: { httpOnly?: boolean; sameSite?: string; secure?: boolean; path?: string } };
const jar = (cookies: Cookie[] | undefined) => Object.fromEntries((cookies ?? []).map((c) => [c.name, c.value]));

async function csrf(options: AuthOptions, origin: string) {
  const r = await AuthHandler({ req: { action: 'csrf', method: 'GET', origin, headers: {}, cookies: {} }, options });
  return { token: (r.body as { csrfToken: string }).csrfToken, cookies: r.cookies as Cookie[] };
}

async function signInWithPassword(options: AuthOptions, origin: string) {
  const c = await csrf(options, origin);
  const r = await AuthHandler({
    req: {
      action: 'callback',
      providerId: 'credentials',
      method: 'POST',
      origin,
      headers: {},
      cookies: jar(c.cookies),
      body: { email: 'member@candlewise.test', password: DEMO_PASSWORD, csrfToken: c.token },
    },
    options,
  });
  return [...c.cookies, ...((r.cookies ?? []) as Cookie[])];
}

describe('session cookies', () => {
  it('are HttpOnly and SameSite=Lax, without Secure, on a plain-http address', async () => {
    const options = await optionsFor('http://127.0.0.1:3000');
    const cookies = await signInWithPassword(options, 'http://127.0.0.1:3000');
    const session = cookies.find((c) => c.name === 'next-auth.session-token');
    expect(session?.value).toBeTruthy();
    for (const c of cookies) {
      expect(c.options.httpOnly, c.name).toBe(true);
      expect(c.options.sameSite, c.name).toBe('lax');
      expect(c.options.secure, c.name).toBe(false);
    }
  });

  it('are Secure, and carry the __Secure-/__Host- prefixes, when NEXTAUTH_URL is https', async () => {
    const options = await optionsFor('https://club.example');
    expect(options.useSecureCookies).toBe(true);
    const cookies = await signInWithPassword(options, 'https://club.example');
    const names = cookies.map((c) => c.name);
    expect(names).toContain('__Secure-next-auth.session-token');
    expect(names).toContain('__Host-next-auth.csrf-token');
    for (const c of cookies) {
      expect(c.options.secure, c.name).toBe(true);
      expect(c.options.httpOnly, c.name).toBe(true);
      expect(c.options.sameSite, c.name).toBe('lax');
      expect(c.name.startsWith('__Secure-') || c.name.startsWith('__Host-'), c.name).toBe(true);
    }
  });
});

describe('e-mail sign-in links', () => {
  const origin = 'http://127.0.0.1:3000';

  async function requestLink(options: AuthOptions, email: string) {
    const before = sent.length;
    const c = await csrf(options, origin);
    await AuthHandler({
      req: { action: 'signin', providerId: 'email', method: 'POST', origin, headers: {}, cookies: jar(c.cookies), body: { email, csrfToken: c.token } },
      options,
    });
    // The send is queued after the answer (so a member's address answers like a stranger's):
    // nothing has gone yet when next-auth answers, and the link follows shortly.
    expect(sent.length).toBe(before);
    for (let i = 0; i < 100 && sent.length === before; i++) await new Promise((r) => setTimeout(r, 20));
    expect(sent.length).toBe(before + 1);
    return new URL(sent[sent.length - 1].url);
  }

  async function follow(options: AuthOptions, link: URL) {
    const r = await AuthHandler({
      req: { action: 'callback', providerId: 'email', method: 'GET', origin, headers: {}, cookies: {}, query: Object.fromEntries(link.searchParams) },
      options,
    });
    return { redirect: r.redirect ?? '', session: ((r.cookies ?? []) as Cookie[]).some((c) => c.name.endsWith('next-auth.session-token') && c.value) };
  }

  it('are configured to expire after 15 minutes', async () => {
    const { EMAIL_LINK_MAX_AGE } = await import('@/lib/auth/options');
    expect(EMAIL_LINK_MAX_AGE).toBe(15 * 60);
  });

  it('work once', async () => {
    const options = await optionsFor(origin);
    const link = await requestLink(options, 'librarian@candlewise.test');
    const first = await follow(options, link);
    expect(first.redirect).not.toContain('error');
    expect(first.session).toBe(true);
    const second = await follow(options, link);
    expect(second.redirect).toContain('error=Verification');
    expect(second.session).toBe(false);
  });

  it('still work at 14 minutes and no longer at 16', async () => {
    const options = await optionsFor(origin);
    vi.useFakeTimers({ toFake: ['Date'], now: new Date() });
    const early = await requestLink(options, 'editor@candlewise.test');
    vi.setSystemTime(Date.now() + 14 * 60_000);
    expect((await follow(options, early)).session).toBe(true);

    vi.setSystemTime(new Date());
    const late = await requestLink(options, 'editor@candlewise.test');
    vi.setSystemTime(Date.now() + 16 * 60_000);
    const r = await follow(options, late);
    expect(r.redirect).toContain('error=Verification');
    expect(r.session).toBe(false);
  });
});
