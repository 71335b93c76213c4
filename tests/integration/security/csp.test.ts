import { describe, expect, inject, it } from 'vitest';
import { newPhoto } from './club-fixtures';
import { Fixtures } from './fixtures';

// Scripts on pages run only from our origin or with this response's nonce: no 'unsafe-inline'
// backstop an injected <script> could ride on. The photo route's strict policy is the one sent.
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

describe('Content-Security-Policy', () => {
  for (const path of ['/', '/sign-in', '/species', '/no-such-page']) {
    it(`${path}: script-src has a fresh nonce and no 'unsafe-inline', and every inline script carries it`, async () => {
      const nonces: string[] = [];
      for (let i = 0; i < 2; i++) {
        const res = await fetch(base + path);
        const html = await res.text();
        const policies = res.headers.get('content-security-policy')!.split(',');
        expect(policies).toHaveLength(1);
        const script = directives(policies[0])['script-src'];
        expect(script).not.toContain("'unsafe-inline'");
        expect(script).not.toContain("'unsafe-eval'");
        const nonce = script.find((s) => s.startsWith("'nonce-"))?.slice(7, -1);
        expect(nonce, 'a nonce in script-src').toBeTruthy();
        expect(nonce!.length).toBeGreaterThanOrEqual(16);
        nonces.push(nonce!);
        const scripts = [...html.matchAll(/<script\b([^>]*)>/g)].map((m) => m[1]);
        expect(scripts.length).toBeGreaterThan(0);
        for (const attrs of scripts) {
          if (/\bsrc=/.test(attrs) && !/\bnonce=/.test(attrs)) continue; // same-origin file
          expect(attrs).toContain(`nonce="${nonce}"`);
        }
      }
      expect(nonces[0]).not.toBe(nonces[1]);
    });
  }

  it("the photo route sends its own default-src 'none' and sandbox, nothing looser", async () => {
    const id = await newPhoto(f, 'member');
    const res = await (await f.client('member')).get(`/api/uploads/${id}`);
    await res.body?.cancel();
    expect(res.status).toBe(200);
    const policies = res.headers.get('content-security-policy')!.split(',');
    for (const p of policies) {
      const d = directives(p);
      expect(d['default-src']).toEqual(["'none'"]);
      expect(d.sandbox).toEqual([]);
      expect(p).not.toContain("'self'");
    }
  });
});
