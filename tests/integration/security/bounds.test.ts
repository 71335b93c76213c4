import { describe, expect, inject, it } from 'vitest';
import { treeBody } from './bodies';
import { currentSpecies, matrixSpecies, newNote, newTree, uniqueLetters } from './club-fixtures';
import { Fixtures } from './fixtures';

// Values PostgreSQL cannot store (year 0000, years far out of range, integers past 32 bits) are
// refused at the edge with a 4xx naming the field, never a 500 from the database.
const base = inject('baseUrl');
const f = new Fixtures(base);
const is4xx = (s: number) => s >= 400 && s < 500;

const BAD_DATES = ['0000-01-01', '0000-02-29', '0001-06-01', '9999-12-31', '1066-10-14'];

describe('out-of-range values get 4xx, not 500', () => {
  for (const d of BAD_DATES) {
    it(`a tree acquired on ${d}`, async () => {
      const c = await f.client('member');
      const r = await c.json('/api/trees', 'POST', { ...(await treeBody(f)), acquiredOn: d });
      expect(r.status).toBe(422);
      expect(r.body.error.fields).toHaveProperty('acquiredOn');
      const id = await newTree(f, 'member');
      const p = await c.json(`/api/trees/${id}`, 'PATCH', { acquiredOn: d });
      expect(p.status).toBe(422);
    });

    it(`a meeting held on ${d}`, async () => {
      const c = await f.client('librarian');
      const r = await c.json('/api/notes', 'POST', { title: `Bounds ${uniqueLetters()}`, meetingDate: d, body: 'Candles.', status: 'draft' });
      expect(r.status).toBe(422);
      expect(r.body.error.fields).toHaveProperty('meetingDate');
      const slug = await newNote(f, 'draft');
      expect((await c.json(`/api/notes/${slug}`, 'PATCH', { meetingDate: d })).status).toBe(422);
      expect((await c.json(`/api/notes/linkable-answers?from=${d}`, 'GET')).status).toBe(400);
    });
  }

  it('a stale-edit timestamp in year 0000', async () => {
    const c = await f.client('librarian');
    const slug = await newNote(f, 'draft');
    const r = await c.json(`/api/notes/${slug}`, 'PATCH', { body: 'Again.', expectedUpdatedAt: '0000-01-01T00:00:00Z' });
    expect(r.status).toBe(422);
  });

  for (const iso of ['+275760-09-13T00:00:00.000Z', '-271821-04-20T00:00:00.000Z', '0000-01-01T00:00:00.000Z', '+010000-01-01T00:00:00.000Z']) {
    it(`an answer cursor dated ${iso}`, async () => {
      const c = await f.client('member');
      const cursor = Buffer.from(`${iso}|abcdefghijklmnop`).toString('base64url');
      for (const scope of ['', '&scope=club']) {
        const r = await c.json(`/api/answers?cursor=${cursor}${scope}`, 'GET');
        expect(is4xx(r.status), `status ${r.status}`).toBe(true);
        expect(r.body.error.fields).toHaveProperty('cursor');
      }
    });
  }

  for (const n of [2 ** 31, 2 ** 40, Number.MAX_SAFE_INTEGER]) {
    it(`a species revision number of ${n}`, async () => {
      const c = await f.client('editor');
      const slug = await matrixSpecies(f);
      const s = await currentSpecies(f, slug);
      const patch = await c.json(`/api/species/${slug}`, 'PATCH', { record: s.record, body: s.body, summary: 'bounds', publish: true, baseRevision: n });
      expect(patch.status).toBe(422);
      expect(patch.body.error.fields).toHaveProperty('baseRevision');
      const revert = await c.json(`/api/species/${slug}/revert`, 'POST', { toRevision: n, baseRevision: s.revision, summary: 'bounds', publish: true });
      expect(revert.status).toBe(422);
      expect(revert.body.error.fields).toHaveProperty('toRevision');
      expect(is4xx((await c.json(`/api/species/${slug}?revision=${n}`, 'GET')).status)).toBe(true);
    });
  }
});
