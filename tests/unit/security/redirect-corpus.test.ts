import { describe, expect, it } from 'vitest';
import { safeCallbackPath } from '@/lib/http/safe-redirect';
import { REDIRECT_CORPUS } from '../../support/redirect-corpus';

const origin = 'http://127.0.0.1:3000';

describe('the callback URL after sign-in', () => {
  for (const bad of REDIRECT_CORPUS) {
    it(`never leaves the origin for ${JSON.stringify(bad)}`, () => {
      const out = safeCallbackPath(bad, origin);
      // What a browser would make of it, resolved against our own page.
      expect(new URL(out, origin).origin).toBe(origin);
      expect(out.startsWith('/')).toBe(true);
      expect(out.startsWith('//')).toBe(false);
      expect(out).not.toMatch(/[\\\t\n\r]/);
    });
  }

  it('keeps a same-origin path with its query and hash', () => {
    expect(safeCallbackPath('/trees/abc?tab=photos#top', origin)).toBe('/trees/abc?tab=photos#top');
    expect(safeCallbackPath(`${origin}/notes`, origin)).toBe('/notes');
    expect(safeCallbackPath('/species/pinus-thunbergii', origin)).toBe('/species/pinus-thunbergii');
  });

  it('falls back to the home page for anything else', () => {
    expect(safeCallbackPath(undefined, origin)).toBe('/');
    expect(safeCallbackPath('https://evil.example/', origin)).toBe('/');
    expect(safeCallbackPath('/\\evil.example', origin)).toBe('/');
  });
});
