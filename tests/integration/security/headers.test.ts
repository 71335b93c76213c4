import { describe, expect, inject, it } from 'vitest';
import { Fixtures } from './fixtures';

// Response headers on pages, API answers, errors and static files; cookie flags on sign-in
// (the Secure flag behind https is checked in tests/unit/security/auth-config.test.ts).
const base = inject('baseUrl');
const f = new Fixtures(base);

function directives(csp: string) {
  return Object.fromEntries(
    csp
      .split(';')
      .map((d) => d.trim())
      .filter(Boolean)
      .map((d) => {
        const [name, ...values] = d.split(/\s+/);
        return [name.toLowerCase(), values];
      }),
  ) as Record<string, string[]>;
}

async function staticAsset() {
  const html = await (await fetch(`${base}/`)).text();
  const src = html.match(/\/_next\/static\/[^"']+\.js/)?.[0];
  if (!src) throw new Error('no script in the home page');
  return src;
}

describe('security headers', () => {
  const paths = ['/', '/sign-in', '/species', '/api/health', '/api/me', '/api/users', '/no-such-page', '/api/no-such-route'];

  it.each(paths)('%s carries CSP with frame-ancestors, nosniff, a referrer policy and no X-Powered-By', async (p) => {
    const res = await fetch(base + p, { redirect: 'manual' });
    await res.body?.cancel();
    const csp = res.headers.get('content-security-policy');
    expect(csp, 'Content-Security-Policy').toBeTruthy();
    const d = directives(csp!);
    expect(d['frame-ancestors']).toEqual(["'none'"]);
    expect(d['object-src']).toEqual(["'none'"]);
    // Pages allow our own origin; API answers are never documents, so they allow nothing.
    const api = p.startsWith('/api/');
    expect(d['base-uri']).toEqual([api ? "'none'" : "'self'"]);
    expect(d['default-src']).toEqual([api ? "'none'" : "'self'"]);
    if (!api) {
      expect(d['script-src']).not.toContain("'unsafe-eval'");
      expect(d['script-src'].some((s) => s === '*' || s.startsWith('http'))).toBe(false);
    } else {
      expect(d['script-src']).toBeUndefined();
      expect(d.sandbox).toEqual([]);
    }
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(['no-referrer', 'same-origin', 'strict-origin', 'strict-origin-when-cross-origin']).toContain(res.headers.get('referrer-policy'));
    expect(res.headers.get('x-frame-options')).toBe('DENY');
    expect(res.headers.get('x-powered-by')).toBeNull();
  });

  it('static scripts are served with nosniff too', async () => {
    const res = await fetch(base + (await staticAsset()));
    await res.body?.cancel();
    expect(res.status).toBe(200);
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
  });

  it('API answers are JSON and not cached by shared caches when they depend on the session', async () => {
    const member = await f.client('member');
    const res = await member.get('/api/me');
    await res.body?.cancel();
    expect(res.headers.get('content-type')).toMatch(/^application\/json/);
    expect(res.headers.get('cache-control') ?? '').not.toMatch(/\bpublic\b/);
  });
});

describe('cookies', () => {
  it('every cookie the sign-in flow sets is HttpOnly and SameSite=Lax, on path /', async () => {
    const setCookies: string[] = [];
    const csrf = await fetch(`${base}/api/auth/csrf`);
    setCookies.push(...csrf.headers.getSetCookie());
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const cookie = setCookies.map((s) => s.split(';')[0]).join('; ');
    const res = await fetch(`${base}/api/auth/callback/credentials`, {
      method: 'POST',
      redirect: 'manual',
      headers: { 'content-type': 'application/x-www-form-urlencoded', cookie, 'x-auth-return-redirect': '1' },
      body: new URLSearchParams({ email: 'member@candlewise.test', password: 'candlewise-demo', csrfToken, json: 'true' }).toString(),
    });
    setCookies.push(...res.headers.getSetCookie());
    await res.body?.cancel();
    expect(setCookies.some((s) => s.startsWith('next-auth.session-token='))).toBe(true);
    for (const s of setCookies) {
      const attrs = s
        .split(';')
        .slice(1)
        .map((a) => a.trim().toLowerCase());
      expect(attrs, s).toContain('httponly');
      expect(attrs, s).toContain('samesite=lax');
      expect(attrs, s).toContain('path=/');
    }
  });
});
