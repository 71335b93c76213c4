import { afterAll, describe, expect, inject, it } from 'vitest';
import fc from 'fast-check';
import { ACTORS, Fixtures, type Actor } from './fixtures';
import { routeMatrix, statusOk, type RouteRow } from './route-matrix';

// Property-based bad input against every JSON route: whatever the body, the query or the id in
// the path, the answer is never a 5xx. Bounded runs (FUZZ_RUNS, default 60 per route and kind);
// a failure prints the fast-check seed and path to replay it.
const base = inject('baseUrl');
const f = new Fixtures(base);
const RUNS = Number(process.env.FUZZ_RUNS ?? 60);

const jsonRows = routeMatrix.filter((r) => r.body === 'json');
const apiGetRows = routeMatrix.filter((r) => r.method === 'GET' && r.kind === 'api');
const dynamicRows = routeMatrix.filter((r) => r.kind === 'api' && /\[[^\]]+\]/.test(r.route));

function fuzzActor(row: RouteRow): Actor {
  if (row.fuzz) return row.fuzz.as;
  return ACTORS.find((a) => [200, 201, 204].some((s) => statusOk(row.expect[a], s))) ?? 'admin';
}

afterAll(async () => {
  for (const row of routeMatrix) await row.fuzz?.restore?.(f);
});

// Values that break careless handlers: wrong types, huge and tiny numbers, odd strings.
const nasty = fc.oneof(
  fc.jsonValue(),
  fc.string({ unit: 'binary', maxLength: 300 }),
  fc.constantFrom(
    '',
    ' ',
    '\u0000',
    '\uD800',
    'null',
    'true',
    '1e309',
    '-0',
    '../../etc/passwd',
    '<script>alert(1)</script>',
    "'; drop table users; --",
    '%00',
    'ＡＢＣ',
  ),
  fc.constantFrom(0, -1, 1e308, -1e308, Number.MAX_SAFE_INTEGER + 2, 1e-320, 0.1),
  fc.array(fc.jsonValue(), { maxLength: 5 }),
  fc.dictionary(fc.string({ maxLength: 10 }), fc.jsonValue(), { maxKeys: 5 }),
);

/** Bodies near the valid one (each field replaced, dropped, or joined by extras) and far from it. */
function bodies(valid: unknown) {
  const near =
    valid && typeof valid === 'object' && !Array.isArray(valid)
      ? fc
          .record(
            Object.fromEntries(
              Object.keys(valid).map((k) => [k, fc.option(fc.oneof(fc.constant((valid as Record<string, unknown>)[k]), nasty), { nil: undefined })]),
            ),
            { requiredKeys: [] },
          )
          .chain((r) => fc.dictionary(fc.string({ maxLength: 12 }), nasty, { maxKeys: 3 }).map((extra) => ({ ...extra, ...r })))
      : nasty;
  return fc.oneof(
    { weight: 3, arbitrary: near.map((b) => ({ text: JSON.stringify(b) ?? 'null' })) },
    { weight: 1, arbitrary: fc.jsonValue().map((b) => ({ text: JSON.stringify(b) ?? 'null' })) },
    // Not JSON at all, or JSON cut short.
    { weight: 1, arbitrary: fc.string({ unit: 'binary', maxLength: 200 }).map((text) => ({ text })) },
    { weight: 1, arbitrary: fc.constant(JSON.stringify(valid)).chain((s) => fc.nat({ max: Math.max(0, s.length - 1) }).map((n) => ({ text: s.slice(0, n) }))) },
  );
}

describe('fuzzing', () => {
  it.each(jsonRows.map((r) => [r.route, r] as const))('%s never answers 5xx to any body', async (_, row) => {
    const actor = fuzzActor(row);
    const client = await f.client(actor);
    const spec = await row.request(f, actor);
    const seen: number[] = [];
    await fc.assert(
      fc.asyncProperty(bodies(spec.json), async ({ text }) => {
        const res = await client.request(spec.path, { method: row.method, headers: { 'content-type': 'application/json' }, body: text });
        seen.push(res.status);
        const body = await res.text();
        if (res.status >= 500) throw new Error(`${res.status} for body ${text.slice(0, 200)} → ${body.slice(0, 200)}`);
      }),
      {
        numRuns: RUNS,
        examples: [[{ text: '{}' }], [{ text: '[]' }], [{ text: 'null' }], [{ text: '"x"' }], [{ text: '' }], [{ text: '{"__proto__":{"role":"admin"}}' }]],
      },
    );
    // The fuzzer did reach validation, not only a blanket refusal.
    expect(seen.some((s) => s === 400 || s === 422)).toBe(true);
    await row.fuzz?.restore?.(f);
  });

  it('refuses an oversize JSON body with 413, not 5xx', async () => {
    const row = jsonRows.find((r) => r.route === 'POST /api/users')!;
    const res = await (
      await f.client('anonymous')
    ).request('/api/users', { method: row.method, headers: { 'content-type': 'application/json' }, body: JSON.stringify({ name: 'x'.repeat(2_000_000) }) });
    expect(res.status).toBe(413);
  });

  it.each(apiGetRows.map((r) => [r.route, r] as const))('%s never answers 5xx to any query string', async (_, row) => {
    const actor = fuzzActor(row);
    const client = await f.client(actor);
    const spec = await row.request(f, actor);
    const url = new URL(spec.path, base);
    const known = [...url.searchParams.keys(), 'q', 'limit', 'cursor', 'sort', 'dir', 'page', 'revision'];
    const query = fc.dictionary(
      fc.oneof(fc.constantFrom(...known), fc.string({ maxLength: 8 })),
      fc.oneof(
        fc.string({ unit: 'binary', maxLength: 120 }),
        nasty.map((v) => JSON.stringify(v) ?? ''),
      ),
      { maxKeys: 4 },
    );
    await fc.assert(
      fc.asyncProperty(query, async (params) => {
        const q = new URLSearchParams();
        for (const [k, v] of Object.entries(params)) q.append(k, v);
        const res = await client.request(`${url.pathname}?${q}`, { method: 'GET' });
        const body = await res.text();
        if (res.status >= 500) throw new Error(`${res.status} for ?${q} → ${body.slice(0, 200)}`);
      }),
      {
        numRuns: Math.ceil(RUNS / 2),
        examples: [[{ q: '\u0000' }], [{ cursor: '\u0000' }], [{ limit: '1e309' }], [{ cursor: 'eyJ4Ijoi' }], [{ sort: '__proto__' }]],
      },
    );
  });

  it.each(dynamicRows.map((r) => [r.route, r] as const))('%s never answers 5xx to any id in the path', async (_, row) => {
    const actor = fuzzActor(row);
    const client = await f.client(actor);
    const spec = await row.request(f, actor);
    const pattern = row.route.split(' ')[1].split('/');
    const real = new URL(spec.path, base).pathname.split('/');
    const at = pattern.findIndex((s) => s.startsWith('['));
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(fc.string({ unit: 'binary', minLength: 1, maxLength: 200 }), fc.constantFrom('..', '%2e%2e', '0', '-1', '9'.repeat(40), 'a'.repeat(5000))),
        async (id) => {
          const parts = [...real];
          parts[at] = encodeURIComponent(id);
          const res = await client.request(parts.join('/'), {
            method: row.method,
            headers: spec.json !== undefined ? { 'content-type': 'application/json' } : {},
            body: spec.json !== undefined ? JSON.stringify(spec.json) : undefined,
          });
          const body = await res.text();
          if (res.status >= 500) throw new Error(`${res.status} for id ${JSON.stringify(id).slice(0, 100)} → ${body.slice(0, 200)}`);
        },
      ),
      { numRuns: Math.ceil(RUNS / 2) },
    );
  });
});
