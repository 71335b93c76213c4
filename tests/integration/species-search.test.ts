import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, signedIn } from '../support/http-client';
import { searchSpecies, type SearchableSpecies } from '@/lib/species/search';

// GET /api/species?q= against the shared ranking module: the browser's search-as-you-type runs the
// same module over the same list, so the API's order must be exactly its order.
const base = inject('baseUrl');
let anon: Client;
let editor: Client;

beforeAll(async () => {
  anon = new Client(base);
  editor = await signedIn(base, 'editor@candlewise.test');
});

type Item = SearchableSpecies & { score?: number; match?: { text: string; kind: string; note: string | null } };

async function all(client: Client, query: string, limit: number): Promise<Item[]> {
  const out: Item[] = [];
  let cursor: string | null = null;
  for (let guard = 0; guard < 200; guard++) {
    const r: { status: number; body: { items: Item[]; nextCursor: string | null } } = await client.json(
      `/api/species?${query}&limit=${limit}${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ''}`,
      'GET',
    );
    expect(r.status).toBe(200);
    out.push(...r.body.items);
    cursor = r.body.nextCursor;
    if (!cursor) return out;
  }
  throw new Error('paging did not end');
}

const queries = [
  'black pine japanese',
  'pine white japanese',
  'japanese black',
  'abies',
  'red pine',
  'white pine',
  'sylvestrus',
  'mugho',
  'scotch',
  'pnus mugo',
  'pine',
  'jap bla',
];

describe('species search API', () => {
  it('returns exactly the shared ranking’s order for every query', async () => {
    const everything = await all(anon, 'x=1', 100);
    expect(everything.length).toBeGreaterThanOrEqual(60);
    for (const q of queries) {
      const api = await all(anon, `q=${encodeURIComponent(q)}`, 100);
      const local = searchSpecies(everything, q);
      expect(
        api.map((i) => i.slug),
        q,
      ).toEqual(local.map((h) => h.item.slug));
      expect(
        api.map((i) => i.score),
        q,
      ).toEqual(local.map((h) => h.score));
    }
  });

  it('pages a search in small pages without repeating or skipping, the same as one big page', async () => {
    for (const q of ['pine', 'white pine', 'spruce']) {
      const big = await all(anon, `q=${encodeURIComponent(q)}`, 100);
      const small = await all(anon, `q=${encodeURIComponent(q)}`, 3);
      expect(big.length).toBeGreaterThan(3);
      expect(small.map((i) => i.slug)).toEqual(big.map((i) => i.slug));
      expect(new Set(small.map((i) => i.slug)).size).toBe(small.length);
    }
  });

  it('keeps a cursor valid across requests and combines it with filters', async () => {
    const first = await anon.json('/api/species?q=pine&group=pine&limit=4', 'GET');
    const cursor = first.body.nextCursor as string;
    // Another request in between must not disturb the continuation (no state held between requests).
    await anon.json('/api/species?q=spruce&limit=2', 'GET');
    const again = await anon.json(`/api/species?q=pine&group=pine&limit=4&cursor=${encodeURIComponent(cursor)}`, 'GET');
    const whole = await all(anon, 'q=pine&group=pine', 100);
    expect([...first.body.items, ...again.body.items].map((i: Item) => i.slug)).toEqual(whole.slice(0, 8).map((i) => i.slug));
  });

  it('says in the result which name a query matched', async () => {
    // Other files of the run copy Scots pine under new names, so look the species up in the results.
    const find = async (q: string, slug: string) =>
      ((await anon.json(`/api/species?q=${encodeURIComponent(q)}`, 'GET')).body.items as Item[]).find((i) => i.slug === slug);
    expect(await find('scotch', 'pinus-sylvestris')).toMatchObject({
      match: { text: 'Scotch pine', kind: 'common', note: 'matched Scotch pine (common name)' },
    });
    expect((await find('sylvestrus', 'pinus-sylvestris'))?.match?.note).toMatch(/^matched .*sylvestris .*spelt differently/);
    expect((await find('pinus mugo', 'pinus-mugo'))?.match?.note).toBeNull();
  });

  it('answers bad parameters with 400 naming the field', async () => {
    const first = await anon.json('/api/species?q=pine&limit=2', 'GET');
    const cursor = encodeURIComponent(first.body.nextCursor);
    const cases: [string, string][] = [
      [`/api/species?q=spruce&limit=2&cursor=${cursor}`, 'cursor'], // a cursor of another query
      [`/api/species?q=pine&group=larch&limit=2&cursor=${cursor}`, 'cursor'], // of other filters
      [`/api/species?limit=2&cursor=${cursor}`, 'cursor'], // a search cursor on the plain list
      ['/api/species?q=pine&cursor=bm90IGpzb24', 'cursor'],
      ['/api/species?q=pine&limit=0', 'limit'],
      ['/api/species?q=pine&limit=101', 'limit'],
      [`/api/species?q=${'a'.repeat(101)}`, 'q'],
      ['/api/species?q=pine&flush=triple', 'flush'],
    ];
    for (const [url, field] of cases) {
      const r = await anon.json(url, 'GET');
      expect(r.status, url).toBe(400);
      expect(r.body.error.fields[field], url).toBeDefined();
    }
  });

  it('finds a species as soon as it is published: the cached search index is dropped on publish', async () => {
    const source = await anon.json('/api/species/pinus-sylvestris', 'GET');
    const record = {
      ...structuredClone(source.body.species.record),
      slug: 'pinus-quaesita',
      botanicalName: 'Pinus quaesita',
      commonNames: ['Seekers pine'],
      synonyms: [],
    };
    // Warm the cache for visitors, then write a draft: still not found.
    expect((await anon.json('/api/species?q=quaesita', 'GET')).body.items).toHaveLength(0);
    const draft = await editor.json('/api/species', 'POST', { record, body: 'Notes', summary: 'draft', publish: false });
    expect(draft.status).toBe(201);
    expect((await anon.json('/api/species?q=quaesita', 'GET')).body.items).toHaveLength(0);
    expect((await editor.json('/api/species?q=quaesita', 'GET')).body.items[0].slug).toBe('pinus-quaesita');
    // Publish: found at once, well inside the cache's lifetime.
    const pub = await editor.json('/api/species/pinus-quaesita', 'PATCH', { record, body: 'Notes', summary: 'publish', publish: true, baseRevision: 1 });
    expect(pub.status).toBe(200);
    expect((await anon.json('/api/species?q=seekers%20pine', 'GET')).body.items[0].slug).toBe('pinus-quaesita');
    // A renamed publish is searchable by the new name at once, and no longer by the old.
    const renamed = { ...record, commonNames: ['Finders pine'] };
    expect(
      (await editor.json('/api/species/pinus-quaesita', 'PATCH', { record: renamed, body: 'Notes', summary: 'rename', publish: true, baseRevision: 2 })).status,
    ).toBe(200);
    const after = await anon.json('/api/species?q=finders', 'GET');
    expect(after.body.items[0].slug).toBe('pinus-quaesita');
    expect((await anon.json('/api/species?q=seekers', 'GET')).body.items.map((i: Item) => i.slug)).not.toContain('pinus-quaesita');
  });
});

describe('species import with a mixed batch', () => {
  it('imports the valid files, lists the others with friendly messages per field, and writes nothing from them', async () => {
    const text = await (await anon.get('/api/species/pinus-mugo/export')).text();
    // Names of its own, so later searches for the names of P. mugo still find P. mugo first.
    const good = text
      .replace('slug: pinus-mugo', 'slug: pinus-mixta')
      .replace('botanicalName: Pinus mugo', 'botanicalName: Pinus mixta')
      .replace(/commonNames:\n(  - .*\n)+/, 'commonNames:\n  - Batch pine\n')
      .replace(/synonyms:\n(  - .*\n)+/, 'synonyms: []\n');
    expect(good).toContain('Batch pine');
    expect(good).not.toContain('mugho');
    const badEnum = good
      .replace('slug: pinus-mixta', 'slug: pinus-errata')
      .replace('botanicalName: Pinus mixta', 'botanicalName: Pinus errata')
      .replace(/group: pine/, 'group: palm');
    const badYaml = good.replace('slug: pinus-mixta', 'slug: pinus-fracta').replace(/group: pine/, 'group: pine: tree');
    const files = [
      { name: 'good.md', content: good },
      { name: 'enum.md', content: badEnum },
      { name: 'yaml.md', content: badYaml },
    ];
    const preview = await editor.json('/api/species/import/preview', 'POST', { files });
    expect(preview.body.files.map((f: { ok: boolean }) => f.ok)).toEqual([true, false, false]);

    // All or nothing unless asked: 422, nothing written.
    const strict = await editor.json('/api/species/import', 'POST', { files, publish: true });
    expect(strict.status).toBe(422);
    expect((await anon.json('/api/species/pinus-mixta', 'GET')).status).toBe(404);

    const r = await editor.json('/api/species/import', 'POST', { files, publish: true, skipInvalid: true });
    expect(r.status).toBe(201);
    expect(r.body.results.map((x: { slug: string }) => x.slug)).toEqual(['pinus-mixta']);
    expect(r.body.skipped.map((x: { name: string }) => x.name)).toEqual(['enum.md', 'yaml.md']);
    const [enumFile, yamlFile] = r.body.skipped;
    expect(enumFile.fields.group).toEqual([
      'Group: “palm” is not one of the choices. Use pine, larch, spruce, fir, douglas-fir, hemlock, cedar, juniper, cypress, redwood, yew, podocarp or other.',
    ]);
    expect(yamlFile.fields.frontMatter[0]).toMatch(
      /^Line \d+, column \d+: Nested mappings are not allowed in compact mappings\. The line reads: group: pine: tree$/,
    );
    expect(JSON.stringify(r.body.skipped)).not.toMatch(/Invalid option|expected one of/);

    expect((await anon.json('/api/species/pinus-mixta', 'GET')).status).toBe(200);
    expect((await anon.json('/api/species/pinus-errata', 'GET')).status).toBe(404);
    expect((await anon.json('/api/species/pinus-fracta', 'GET')).status).toBe(404);
    // Imported and published: found by search at once.
    expect((await anon.json('/api/species?q=mixta', 'GET')).body.items[0].slug).toBe('pinus-mixta');
  });

  it('refuses a batch in which no file is valid, even when asked to leave out bad files', async () => {
    const r = await editor.json('/api/species/import', 'POST', { files: [{ name: 'x.md', content: 'no front matter' }], skipInvalid: true });
    expect(r.status).toBe(422);
    expect(r.body.error.fields['x.md: frontMatter']).toBeDefined();
  });
});
