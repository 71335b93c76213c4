import { describe, expect, inject, it } from 'vitest';
import { ACTORS, Fixtures } from './fixtures';
import { isMutating, routeMatrix } from './route-matrix';

// Authorise first, then validate: on every write, a caller the matrix refuses (401 or 403) gets
// that refusal for a body that is wrong in every way too, never a 422 or 400 with field errors
// (which would tell a stranger the shape of the resource).
const base = inject('baseUrl');
const f = new Fixtures(base);

const BAD_BODIES: { name: string; body: string }[] = [
  { name: 'an empty object', body: '{}' },
  {
    name: 'wrong types everywhere',
    body: JSON.stringify({ title: 7, body: [], name: false, email: 3, slug: {}, commonName: null, species: 9, revision: 'x' }),
  },
  { name: 'malformed JSON', body: '{"title": ' },
];

const rows = routeMatrix.filter((r) => r.kind === 'api' && isMutating(r) && r.body === 'json');

describe('401/403 come before 422 on every write', () => {
  for (const row of rows) {
    for (const actor of ACTORS) {
      const expected = row.expect[actor];
      if (expected !== 401 && expected !== 403) continue;
      for (const bad of BAD_BODIES) {
        it(`${row.route} as ${actor} with ${bad.name}: ${expected}`, async () => {
          const spec = await row.request(f, actor);
          const client = spec.client ?? (await f.client(actor));
          const r = await client.request(spec.path, { method: row.method, headers: { 'content-type': 'application/json', ...spec.headers }, body: bad.body });
          const text = await r.text();
          expect(r.status, text).toBe(expected);
          expect(text).not.toContain('"fields"');
        });
      }
    }
  }
});
