import { describe, expect, inject, it } from 'vitest';
import { Fixtures } from './fixtures';
import { routeMatrix } from './route-matrix';

// A malformed id or slug names nothing: 404 on every API route that takes one, for a caller who
// may use the route (an admin), with the row's own valid body, never a 400 or 422.
const base = inject('baseUrl');
const f = new Fixtures(base);

const MALFORMED = ['not-an-id!', 'x', "1'or'1'='1", 'A'.repeat(300), '%00', '..%2F..%2Fetc'];
const rows = routeMatrix.filter((r) => r.kind === 'api' && /\[(id|slug)\]/.test(r.route));

describe('a malformed id is 404 everywhere', () => {
  for (const row of rows) {
    it(`${row.route}`, async () => {
      const spec = await row.request(f, 'admin');
      const client = spec.client ?? (await f.client('admin'));
      const [, param] = /\/api\/(?:[a-z-]+\/)*?(?:answers|trees|uploads|users|notes|species|runs)\/([^/?]+)/.exec(spec.path) ?? [];
      expect(param, spec.path).toBeTruthy();
      for (const bad of MALFORMED) {
        const path = spec.path.replace(`/${param}`, `/${bad}`);
        const headers: Record<string, string> = { ...spec.headers };
        let body: BodyInit | undefined;
        if (spec.json !== undefined) {
          headers['content-type'] = 'application/json';
          body = JSON.stringify(spec.json);
        } else if (spec.multipart) body = await spec.multipart();
        const res = await client.request(path, { method: row.method, headers, body });
        expect(res.status, `${row.method} ${path}: ${await res.text()}`).toBe(404);
      }
    });
  }
});
