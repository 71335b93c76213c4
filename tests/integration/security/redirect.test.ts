import { describe, expect, inject, it } from 'vitest';
import { Client, DEMO_PASSWORD } from '../../support/http-client';
import { REDIRECT_CORPUS } from '../../support/redirect-corpus';

// next-auth's own redirect after sign-in (its `url` answer and the sign-in page's hidden value)
// stays on the origin for every open-redirect form.
const base = inject('baseUrl');
const own = new URL(base).origin;

describe('the redirect after sign-in, on the server', () => {
  for (const bad of REDIRECT_CORPUS) {
    it(`stays on the origin for callbackUrl ${JSON.stringify(bad)}`, async () => {
      const c = new Client(base);
      const csrfToken = await c.csrf();
      const res = await c.request('/api/auth/callback/credentials', {
        method: 'POST',
        headers: { 'content-type': 'application/x-www-form-urlencoded' },
        body: new URLSearchParams({ email: 'member@candlewise.test', password: DEMO_PASSWORD, csrfToken, callbackUrl: bad, json: 'true' }).toString(),
      });
      const { url } = (await res.json()) as { url: string };
      // A browser resolves it against the page it is on: it must stay here.
      expect(new URL(url, base).origin).toBe(own);
      expect(new URL(url, base).pathname.startsWith('//')).toBe(false);

      const page = await (await c.get(`/sign-in?callbackUrl=${encodeURIComponent(bad)}`)).text();
      // The page hands its form only the checked value: a same-origin path.
      const handed = [...page.matchAll(/callbackUrl\\*":\\*"([^"\\]*)\\*"/g)].map((m) => m[1]);
      expect(handed.length).toBeGreaterThan(0);
      for (const h of handed) {
        expect(h.startsWith('/') && !h.startsWith('//')).toBe(true);
        expect(new URL(h, base).origin).toBe(own);
      }
    });
  }
});
