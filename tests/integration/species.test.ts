import { beforeAll, describe, expect, inject, it } from 'vitest';
import { unzipSync, strFromU8 } from 'fflate';
import { Client, signedIn } from '../support/http-client';

const base = inject('baseUrl');
let anon: Client;
let member: Client;
let editor: Client;
let admin: Client;

beforeAll(async () => {
  anon = new Client(base);
  [member, editor, admin] = await Promise.all([
    signedIn(base, 'member@candlewise.test'),
    signedIn(base, 'editor@candlewise.test'),
    signedIn(base, 'admin@candlewise.test'),
  ]);
});

async function publishedRecord(slug: string) {
  const r = await anon.json(`/api/species/${slug}`, 'GET');
  expect(r.status).toBe(200);
  return r.body.species as { record: any; body: string; revision: number; latestRevision: number };
}

function newRecord(from: any, slug: string, botanicalName: string) {
  return { ...structuredClone(from), slug, botanicalName };
}

describe('GET /api/species', () => {
  it('lists published species with the contract fields, to anyone', async () => {
    const r = await anon.json('/api/species?limit=5', 'GET');
    expect(r.status).toBe(200);
    expect(r.body.items).toHaveLength(5);
    expect(r.body.items[0]).toMatchObject({
      slug: expect.any(String),
      botanicalName: expect.any(String),
      commonNames: expect.any(Array),
      needleLengthMm: { min: expect.any(Number), max: expect.any(Number) },
    });
    expect(typeof r.body.nextCursor).toBe('string');
    const next = await anon.json(`/api/species?limit=5&cursor=${encodeURIComponent(r.body.nextCursor)}`, 'GET');
    expect(next.body.items[0].slug).not.toBe(r.body.items[4].slug);
  });

  it('ranks misspellings first and filters', async () => {
    for (const [q, slug] of [
      ['sylvestrus', 'pinus-sylvestris'],
      ['mugho', 'pinus-mugo'],
      ['scotch', 'pinus-sylvestris'],
    ]) {
      const r = await anon.json(`/api/species?q=${q}`, 'GET');
      expect(r.body.items[0].slug).toBe(slug);
    }
    const doubles = await anon.json('/api/species?flush=double&group=pine', 'GET');
    expect(doubles.body.items.map((i: any) => i.slug).sort()).toEqual(['pinus-densiflora', 'pinus-thunbergii']);
  });

  it('answers a bad query with 400 naming the field', async () => {
    const r = await anon.json('/api/species?vigour=enormous', 'GET');
    expect(r.status).toBe(400);
    expect(r.body.error.fields.vigour).toBeDefined();
    const c = await anon.json('/api/species?cursor=garbage', 'GET');
    expect(c.status).toBe(400);
    expect(c.body.error.fields.cursor).toBeDefined();
  });
});

describe('GET /api/species/[slug]', () => {
  it('gives the published revision, 404 for an unknown slug', async () => {
    const s = await publishedRecord('pinus-thunbergii');
    expect(s.record.traits.flushHabit.value).toBe('double');
    expect((await anon.json('/api/species/pinus-nonexistens', 'GET')).status).toBe(404);
    expect((await anon.json('/api/species/NOT_A_SLUG', 'GET')).status).toBe(404);
  });

  it('keeps ?revision=N for editors: 401 anonymous, 403 member', async () => {
    expect((await anon.json('/api/species/pinus-mugo?revision=1', 'GET')).status).toBe(401);
    expect((await member.json('/api/species/pinus-mugo?revision=1', 'GET')).status).toBe(403);
    expect((await editor.json('/api/species/pinus-mugo?revision=1', 'GET')).status).toBe(200);
    expect((await editor.json('/api/species/pinus-mugo?revision=999', 'GET')).status).toBe(404);
  });
});

describe('editing species', () => {
  it('refuses writes from anonymous (401) and members (403)', async () => {
    const s = await publishedRecord('pinus-sylvestris');
    const body = { record: newRecord(s.record, 'pinus-anonyma', 'Pinus anonyma'), body: '', summary: '', publish: true };
    expect((await anon.json('/api/species', 'POST', body)).status).toBe(401);
    expect((await member.json('/api/species', 'POST', body)).status).toBe(403);
    const patch = { record: s.record, body: s.body, summary: 'x', publish: true, baseRevision: s.latestRevision };
    expect((await anon.json('/api/species/pinus-sylvestris', 'PATCH', patch)).status).toBe(401);
    expect((await member.json('/api/species/pinus-sylvestris', 'PATCH', patch)).status).toBe(403);
    expect((await member.json('/api/species/pinus-sylvestris/revert', 'POST', { toRevision: 1, baseRevision: 1 })).status).toBe(403);
    expect((await member.json('/api/species/import/preview', 'POST', { files: [{ name: 'a.md', content: 'x' }] })).status).toBe(403);
    expect((await anon.json('/api/species/pinus-sylvestris/revisions', 'GET')).status).toBe(401);
  });

  it('lets an editor create a draft that members cannot see, then publish it', async () => {
    const s = await publishedRecord('pinus-sylvestris');
    const created = await editor.json('/api/species', 'POST', {
      record: newRecord(s.record, 'pinus-probatio', 'Pinus probatio'),
      body: '# Draft notes',
      summary: 'new',
      publish: false,
    });
    expect(created.status).toBe(201);
    expect(created.body.species).toMatchObject({ revision: 1, status: 'draft', publishedRevision: null });

    expect((await member.json('/api/species/pinus-probatio', 'GET')).status).toBe(404);
    expect((await anon.json('/api/species/pinus-probatio', 'GET')).status).toBe(404);
    expect((await member.json('/api/species?q=probatio', 'GET')).body.items).toHaveLength(0);
    expect((await member.json('/api/species/pinus-probatio/revisions', 'GET')).status).toBe(404);
    expect((await editor.json('/api/species/pinus-probatio', 'GET')).body.species.status).toBe('draft');

    const dup = await editor.json('/api/species', 'POST', {
      record: newRecord(s.record, 'pinus-probatio', 'Pinus probatio'),
      body: '',
      summary: '',
      publish: false,
    });
    expect(dup.status).toBe(409);

    const pub = await editor.json('/api/species/pinus-probatio', 'PATCH', {
      record: newRecord(s.record, 'pinus-probatio', 'Pinus probatio'),
      body: 'Published notes',
      summary: 'publish',
      publish: true,
      baseRevision: 1,
    });
    expect(pub.status).toBe(200);
    expect(pub.body.species).toMatchObject({ revision: 2, publishedRevision: 2 });
    expect((await member.json('/api/species/pinus-probatio', 'GET')).body.species.body).toContain('Published notes');

    // A later draft stays invisible: members still get revision 2.
    const draft = await admin.json('/api/species/pinus-probatio', 'PATCH', {
      record: newRecord(s.record, 'pinus-probatio', 'Pinus probatio'),
      body: 'Secret draft',
      summary: 'draft',
      publish: false,
      baseRevision: 2,
    });
    expect(draft.status).toBe(200);
    const seen = await member.json('/api/species/pinus-probatio', 'GET');
    expect(seen.body.species).toMatchObject({ revision: 2 });
    expect(JSON.stringify(seen.body)).not.toContain('Secret draft');
    const revs = await member.json('/api/species/pinus-probatio/revisions', 'GET');
    expect(revs.body.revisions.map((r: any) => r.revision)).toEqual([2]);
    const editorRevs = await editor.json('/api/species/pinus-probatio/revisions', 'GET');
    expect(editorRevs.body.revisions.map((r: any) => r.revision)).toEqual([3, 2, 1]);
  });

  it('answers a stale baseRevision with 409 and loses nothing', async () => {
    const s = await publishedRecord('pinus-sylvestris');
    const rec = newRecord(s.record, 'pinus-concursus', 'Pinus concursus');
    await editor.json('/api/species', 'POST', { record: rec, body: '', summary: '', publish: true });
    const first = await editor.json('/api/species/pinus-concursus', 'PATCH', { record: rec, body: 'first', summary: 'a', publish: true, baseRevision: 1 });
    expect(first.status).toBe(200);
    const second = await admin.json('/api/species/pinus-concursus', 'PATCH', { record: rec, body: 'second', summary: 'b', publish: true, baseRevision: 1 });
    expect(second.status).toBe(409);
    expect(second.body.error.fields.baseRevision).toBeDefined();
    expect((await anon.json('/api/species/pinus-concursus', 'GET')).body.species.body).toContain('first');
  });

  it('answers invalid bodies with 422 naming the field, and malformed JSON with 400', async () => {
    const s = await publishedRecord('pinus-sylvestris');
    const rec = structuredClone(s.record);
    rec.traits.flushHabit.value = 'triple';
    const r = await editor.json('/api/species/pinus-sylvestris', 'PATCH', {
      record: rec,
      body: '',
      summary: '',
      publish: true,
      baseRevision: s.latestRevision,
    });
    expect(r.status).toBe(422);
    expect(r.body.error.fields['record.traits.flushHabit.value']).toBeDefined();
    const noCitation = structuredClone(s.record);
    delete noCitation.traits.needleLengthMm.citation;
    const r2 = await editor.json('/api/species', 'POST', {
      record: newRecord(noCitation, 'pinus-sinefonte', 'Pinus sinefonte'),
      body: '',
      summary: '',
      publish: true,
    });
    expect(r2.status).toBe(422);
    expect(r2.body.error.fields['record.traits.needleLengthMm.citation']).toBeDefined();
    // The same record saves as a draft: only publishing needs every citation.
    const draftSave = await editor.json('/api/species', 'POST', {
      record: newRecord(noCitation, 'pinus-sinefonte', 'Pinus sinefonte'),
      body: '',
      summary: '',
      publish: false,
    });
    expect(draftSave.status).toBe(201);
    const publishLater = await editor.json('/api/species/pinus-sinefonte/revert', 'POST', { toRevision: 1, baseRevision: 1, publish: true });
    expect(publishLater.status).toBe(422);
    expect(publishLater.body.error.fields['record.traits.needleLengthMm.citation']).toBeDefined();
    const noBase = await editor.json('/api/species/pinus-sylvestris', 'PATCH', { record: s.record, body: '', summary: '', publish: true });
    expect(noBase.status).toBe(422);
    expect(noBase.body.error.fields.baseRevision).toBeDefined();
    const renamed = await editor.json('/api/species/pinus-sylvestris', 'PATCH', {
      record: { ...s.record, slug: 'pinus-alia' },
      body: '',
      summary: '',
      publish: true,
      baseRevision: s.latestRevision,
    });
    expect(renamed.status).toBe(422);
    expect(renamed.body.error.fields['record.slug']).toBeDefined();
    const raw = await editor.request('/api/species', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{not json' });
    expect(raw.status).toBe(400);
    const unknown = await editor.json('/api/species/pinus-nonexistens', 'PATCH', {
      record: { ...s.record, slug: 'pinus-nonexistens' },
      body: '',
      summary: '',
      publish: true,
      baseRevision: 1,
    });
    expect(unknown.status).toBe(404);
  });

  it('reverts as a new revision', async () => {
    const s = await publishedRecord('pinus-concursus');
    const r = await editor.json('/api/species/pinus-concursus/revert', 'POST', { toRevision: 1, baseRevision: s.latestRevision });
    expect(r.status).toBe(201);
    expect(r.body.species.revision).toBe(s.latestRevision + 1);
    expect((await anon.json('/api/species/pinus-concursus', 'GET')).body.species.body).not.toContain('first');
  });
});

describe('import and export', () => {
  it('exports a species as .md and everything as a zip of .md files', async () => {
    const md = await anon.get('/api/species/pinus-mugo/export');
    expect(md.status).toBe(200);
    expect(md.headers.get('content-type')).toContain('text/markdown');
    const text = await md.text();
    expect(text).toMatch(/^---\nslug: pinus-mugo\n/);
    const zip = await anon.get('/api/species/export');
    expect(zip.headers.get('content-type')).toBe('application/zip');
    const files = unzipSync(new Uint8Array(await zip.arrayBuffer()));
    expect(Object.keys(files).length).toBeGreaterThanOrEqual(24);
    expect(strFromU8(files['pinus-mugo.md'])).toBe(text);
  });

  it('previews per-field errors without writing, and imports valid files', async () => {
    const text = await (await anon.get('/api/species/pinus-mugo/export')).text();
    const fresh = text.replace('slug: pinus-mugo', 'slug: pinus-importata').replace('botanicalName: Pinus mugo', 'botanicalName: Pinus importata');
    const broken = fresh.replace('slug: pinus-importata', 'slug: Bad Slug');
    const prev = await editor.json('/api/species/import/preview', 'POST', {
      files: [
        { name: 'good.md', content: fresh },
        { name: 'bad.md', content: broken },
      ],
    });
    expect(prev.status).toBe(200);
    expect(prev.body.files[0]).toMatchObject({ ok: true, action: 'create' });
    expect(prev.body.files[1].ok).toBe(false);
    expect(prev.body.files[1].fields.slug).toBeDefined();
    expect((await editor.json('/api/species/pinus-importata', 'GET')).status).toBe(404);
    const bad = await editor.json('/api/species/import', 'POST', {
      files: [
        { name: 'good.md', content: fresh },
        { name: 'bad.md', content: broken },
      ],
      publish: true,
    });
    expect(bad.status).toBe(422);
    expect((await editor.json('/api/species/pinus-importata', 'GET')).status).toBe(404);
    const ok = await editor.json('/api/species/import', 'POST', { files: [{ name: 'good.md', content: fresh }], publish: true });
    expect(ok.status).toBe(201);
    expect((await anon.json('/api/species/pinus-importata', 'GET')).status).toBe(200);
  });
});

describe('species pages', () => {
  it('serves the list and a species page to anyone, 404 for unknown', async () => {
    expect((await anon.get('/species')).status).toBe(200);
    const page = await anon.get('/species/pinus-thunbergii');
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Japanese black pine');
    expect((await anon.get('/species/pinus-nonexistens')).status).toBe(404);
  });

  it('guards the editor pages: sign-in redirect, 403 for members', async () => {
    const a = await anon.get('/species/new');
    expect([303, 307]).toContain(a.status);
    expect(a.headers.get('location')).toContain('/sign-in');
    expect((await member.get('/species/new')).status).toBe(403);
    expect((await member.get('/species/pinus-mugo/edit')).status).toBe(403);
    expect((await member.get('/species/import')).status).toBe(403);
    expect((await editor.get('/species/pinus-mugo/edit')).status).toBe(200);
    expect((await editor.get('/species/new')).status).toBe(200);
    expect((await editor.get('/species/import')).status).toBe(200);
    expect((await editor.get('/species/pinus-nonexistens/edit')).status).toBe(404);
    expect((await member.get('/species/pinus-nonexistens/history')).status).toBe(404);
    expect((await member.get('/species/pinus-mugo/history')).status).toBe(200);
  });
});
