import { describe, expect, inject, it } from 'vitest';
import { Client, signedIn } from '../support/http-client';

const base = inject('baseUrl');
const anon = () => new Client(base);

const body = {
  species: 'pinus-sylvestris',
  branching: 'tertiary',
  date: '2027-05-10',
  shoot: 'candle-extending',
  position: 'beyond-silhouette',
  health: 'average',
};

describe('POST /api/wizard/evaluate', () => {
  it('answers the contract fields for a public request', async () => {
    // source: University of Wisconsin Plant Disease Diagnostics Clinic (2015): remove half to two-thirds of a strong candle
    const r = await anon().json('/api/wizard/evaluate', 'POST', {
      ...body,
      candleStrength: 'strong',
      container: { shape: 'rectangle', lengthCm: 40, widthCm: 30 },
    });
    expect(r.status).toBe(200);
    expect(r.body).toMatchObject({
      action: 'pinch',
      stage: 'refinement',
      season: 'spring',
      keepNeedlePairs: null,
      keepNeedleBundles: null,
      candleKeep: { min: 0.33, max: 0.5 },
      engineVersion: '2.0.0',
      speciesRevision: expect.any(Number),
    });
    expect(r.body.howTo.length).toBeGreaterThan(1);
    expect(r.body.terms.map((t: { term: string }) => t.term)).toContain('candle');
    for (const x of r.body.reasons) expect(Object.keys(x).sort()).toEqual(['rule', 'source', 'text']);
    for (const x of r.body.cautions) expect(Object.keys(x).sort()).toEqual(['source', 'text']);
    expect(r.body.fertilizer).toMatchObject({ feedNow: true, window: expect.any(String), piles: 4, pelletsPerPile: { min: 6, max: 8 }, foliar: false });
    expect(Array.isArray(r.body.fertilizer.reasons)).toBe(true);
  });

  it('gives piles null without a container but keeps pellets per pile', async () => {
    const r = await anon().json('/api/wizard/evaluate', 'POST', body);
    expect(r.status).toBe(200);
    expect(r.body.fertilizer.piles).toBeNull();
    expect(r.body.fertilizer.pelletsPerPile).toEqual({ min: 6, max: 8 });
  });

  it('reads the hemisphere from the latitude and falls back to the club setting', async () => {
    // common practice, no published source: south shifted six months
    const oct = { ...body, date: '2027-10-15' };
    expect((await anon().json('/api/wizard/evaluate', 'POST', { ...oct, hemisphere: 'south', latitude: -50 })).body.season).toBe('spring');
    expect((await anon().json('/api/wizard/evaluate', 'POST', { ...oct, latitude: -34 })).body.season).toBe('spring');
    expect((await anon().json('/api/wizard/evaluate', 'POST', oct)).body.season).toBe('autumn'); // club: north
  });

  it('decandles a strong double-flush pine in early summer', async () => {
    // common practice, no published source
    const r = await anon().json('/api/wizard/evaluate', 'POST', {
      ...body,
      species: 'pinus-thunbergii',
      health: 'strong',
      date: '2027-06-20',
      shoot: 'needles-opening',
    });
    expect(r.body.action).toBe('decandle');
    // …but not while its candles are still extending, nor when it was repotted this year.
    const extending = await anon().json('/api/wizard/evaluate', 'POST', { ...body, species: 'pinus-thunbergii', health: 'strong', date: '2027-06-20' });
    expect(extending.body.action).toBe('let-grow');
    const repotted = await anon().json('/api/wizard/evaluate', 'POST', {
      ...body,
      species: 'pinus-thunbergii',
      health: 'strong',
      date: '2027-06-20',
      shoot: 'needles-opening',
      repottedThisYear: true,
    });
    expect(repotted.body.action).not.toBe('decandle');
    // A low heat sum holds it back (our own threshold).
    const cold = await anon().json('/api/wizard/evaluate', 'POST', {
      ...body,
      species: 'pinus-thunbergii',
      health: 'strong',
      date: '2027-06-20',
      shoot: 'needles-opening',
      degreeDays: 120,
    });
    expect(cold.body.action).toBe('wait');
  });

  it('refuses a hemisphere and latitude that disagree, naming both fields', async () => {
    const r = await anon().json('/api/wizard/evaluate', 'POST', { ...body, hemisphere: 'north', latitude: -35 });
    expect(r.status).toBe(400);
    expect(Object.keys(r.body.error.fields).sort()).toEqual(['hemisphere', 'latitude']);
  });

  it('404s an unknown species', async () => {
    const r = await anon().json('/api/wizard/evaluate', 'POST', { ...body, species: 'pinus-imaginaria' });
    expect(r.status).toBe(404);
    expect(r.body.error.code).toBe('not_found:species');
  });

  it.each([
    [{ ...body, branching: 'quaternary' }, 'branching'],
    [{ ...body, date: '2027-02-30' }, 'date'],
    [{ ...body, shoot: undefined }, 'shoot'],
    [{ ...body, position: undefined }, 'position'],
    [{ ...body, latitude: 123 }, 'latitude'],
    [{ ...body, container: { shape: 'oval', lengthCm: 30 } }, 'container.widthCm'],
    [{ ...body, container: { shape: 'round', lengthCm: -3 } }, 'container.lengthCm'],
    [{ ...body, species: 'Robert; drop table' }, 'species'],
    [{ ...body, candleStrength: 'huge' }, 'candleStrength'],
    [{ ...body, repottedThisYear: 'yes' }, 'repottedThisYear'],
    [{ ...body, degreeDays: -4 }, 'degreeDays'],
  ])('400s a bad body and names the field (%#)', async (b, field) => {
    const r = await anon().json('/api/wizard/evaluate', 'POST', b);
    expect(r.status).toBe(400);
    expect(Object.keys(r.body.error.fields)).toContain(field);
  });

  it('400s malformed JSON and a non-object body', async () => {
    const res = await anon().request('/api/wizard/evaluate', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"species":' });
    expect(res.status).toBe(400);
    expect((await res.json()).error.fields.body).toBeDefined();
    const arr = await anon().json('/api/wizard/evaluate', 'POST', [1, 2]);
    expect(arr.status).toBe(400);
    const nul = await anon().json('/api/wizard/evaluate', 'POST', null);
    expect(nul.status).toBe(400);
  });

  it('refuses a cross-site POST', async () => {
    const r = await anon().json('/api/wizard/evaluate', 'POST', body, { origin: 'https://evil.example' });
    expect(r.status).toBe(403);
  });
});

describe('the answer log', () => {
  it('needs sign-in to save or list', async () => {
    expect((await anon().json('/api/answers', 'POST', body)).status).toBe(401);
    expect((await anon().json('/api/answers', 'GET')).status).toBe(401);
  });

  it('saves an answer with a short unguessable id and returns the result', async () => {
    const m = await signedIn(base, 'member@candlewise.test');
    const r = await m.json('/api/answers', 'POST', { ...body, note: 'south pad' });
    expect(r.status).toBe(201);
    expect(r.body.id).toMatch(/^[A-Za-z0-9_-]{10,}$/);
    expect(r.body.url).toBe(`/answers/${r.body.id}`);
    expect(r.body.action).toBe('pinch');
    const g = await m.json(`/api/answers/${r.body.id}`, 'GET');
    expect(g.status).toBe(200);
    expect(g.body).toMatchObject({
      id: r.body.id,
      visibility: 'private',
      note: 'south pad',
      isOwner: true,
      askerName: 'Wren Alder',
      speciesSlug: 'pinus-sylvestris',
    });
    expect(g.body.input).toMatchObject(body);
    expect(g.body.result.reasons.length).toBeGreaterThan(0);
    expect(JSON.stringify(g.body)).not.toMatch(/candlewise\.test|passwordHash/);
  });

  it('400s a bad save body and a tree that is not yours, 404s an unknown species', async () => {
    const m = await signedIn(base, 'member@candlewise.test');
    expect((await m.json('/api/answers', 'POST', { ...body, visibility: 'world' })).status).toBe(400);
    const t = await m.json('/api/answers', 'POST', { ...body, treeId: 'no-such-tree' });
    expect(t.status).toBe(400);
    expect(t.body.error.fields.treeId).toBeDefined();
    expect((await m.json('/api/answers', 'POST', { ...body, species: 'pinus-imaginaria' })).status).toBe(404);
  });

  it('attaches a saved answer to one of your trees later, and detaches it; never to another member’s tree', async () => {
    const m = await signedIn(base, 'member@candlewise.test');
    const other = await signedIn(base, 'member2@candlewise.test');
    const mine = (await m.json('/api/trees', 'GET')).body;
    const tree = (Array.isArray(mine) ? mine : mine.items).find((t: { name: string }) => t.name === 'Weir-side Scots');
    const theirs = await other.json('/api/trees', 'POST', {
      name: 'Not yours',
      speciesSlug: 'pinus-sylvestris',
      stageNotes: '',
      containerShape: null,
      containerLengthCm: null,
      containerWidthCm: null,
      acquiredOn: null,
      collectedFromWild: false,
      collectedOn: null,
      notes: '',
    });
    expect(theirs.status).toBe(201);
    const saved = await m.json('/api/answers', 'POST', body);
    const path = `/api/answers/${saved.body.id}`;
    expect((await m.json(path, 'GET')).body.treeId).toBeNull();
    const attached = await m.json(path, 'PATCH', { treeId: tree.id });
    expect(attached.status).toBe(200);
    expect(attached.body.treeId).toBe(tree.id);
    const refused = await m.json(path, 'PATCH', { treeId: theirs.body.tree.id });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.treeId).toBeDefined();
    expect((await m.json(path, 'GET')).body.treeId).toBe(tree.id);
    // Someone else cannot attach your answer to their tree either: it is not theirs to know about.
    expect((await other.json(path, 'PATCH', { treeId: theirs.body.tree.id })).status).toBe(404);
    const detached = await m.json(path, 'PATCH', { treeId: null });
    expect(detached.body.treeId).toBeNull();
  });

  it('lists own answers newest first with keyset pages and filters', async () => {
    const m = await signedIn(base, 'member2@candlewise.test');
    const ids: string[] = [];
    for (const [i, shoot] of (['candle-extending', 'needles-opening', 'candle-extending', 'needles-hardened', 'candle-extending'] as const).entries()) {
      const r = await m.json('/api/answers', 'POST', { ...body, shoot, date: `2027-05-1${i}` });
      expect(r.status).toBe(201);
      ids.push(r.body.id);
    }
    const p1 = await m.json('/api/answers?limit=2', 'GET');
    expect(p1.status).toBe(200);
    expect(p1.body.items.map((x: { id: string }) => x.id)).toEqual([ids[4], ids[3]]);
    const p2 = await m.json(`/api/answers?limit=2&cursor=${p1.body.nextCursor}`, 'GET');
    expect(p2.body.items.map((x: { id: string }) => x.id)).toEqual([ids[2], ids[1]]);
    const p3 = await m.json(`/api/answers?limit=2&cursor=${p2.body.nextCursor}`, 'GET');
    expect(p3.body.items.map((x: { id: string }) => x.id)).toEqual([ids[0]]);
    expect(p3.body.nextCursor).toBeNull();
    const pinches = await m.json('/api/answers?action=pinch', 'GET');
    expect(pinches.body.items.map((x: { id: string }) => x.id)).toEqual([ids[4], ids[2], ids[0]]);
    expect((await m.json('/api/answers?species=pinus-mugo', 'GET')).body.items).toEqual([]);
    expect((await m.json('/api/answers?action=explode', 'GET')).status).toBe(400);
    expect((await m.json('/api/answers?cursor=bm9wZQ', 'GET')).status).toBe(400);
    // only their own
    const other = await signedIn(base, 'member@candlewise.test');
    const theirs = (await other.json('/api/answers?limit=100', 'GET')).body.items.map((x: { id: string }) => x.id);
    for (const id of ids) expect(theirs).not.toContain(id);
  });

  it('re-runs a stored answer against today’s engine', async () => {
    const m = await signedIn(base, 'member@candlewise.test');
    const r = await m.json('/api/answers', 'POST', body);
    const rr = await m.json(`/api/answers/${r.body.id}/rerun`, 'GET');
    expect(rr.status).toBe(200);
    expect(rr.body.comparison.same).toBe(true);
    expect(rr.body.current.action).toBe('pinch');
  });
});

describe('IDOR: another member cannot read or change a private answer', () => {
  it('404s read, change, delete and re-run of a private answer; 403s changes to a shared one', async () => {
    const owner = await signedIn(base, 'member@candlewise.test');
    const other = await signedIn(base, 'member2@candlewise.test');
    const { body: saved } = await owner.json('/api/answers', 'POST', body);
    const path = `/api/answers/${saved.id}`;

    expect((await other.json(path, 'GET')).status).toBe(404);
    expect((await other.json(`${path}/rerun`, 'GET')).status).toBe(404);
    expect((await other.json(path, 'PATCH', { followUp: 'mine now' })).status).toBe(404);
    expect((await other.json(path, 'PATCH', { visibility: 'club' })).status).toBe(404);
    expect((await other.json(path, 'DELETE')).status).toBe(404);
    expect((await anon().json(path, 'GET')).status).toBe(401);
    const still = await owner.json(path, 'GET');
    expect(still.body).toMatchObject({ visibility: 'private', followUp: '' });
    // the page too
    const page = await other.get(`/answers/${saved.id}`);
    expect(page.status).toBe(404);

    // owner shares it: the other member can read, not change
    const shared = await owner.json(path, 'PATCH', { visibility: 'club', followUp: 'pinched on 12 May; second elongation by 1 June' });
    expect(shared.status).toBe(200);
    expect(shared.body.followUp).toMatch(/second elongation/);
    const seen = await other.json(path, 'GET');
    expect(seen.status).toBe(200);
    expect(seen.body).toMatchObject({ isOwner: false, askerName: 'Wren Alder', treeId: null });
    expect((await other.json(path, 'PATCH', { note: 'x' })).status).toBe(403);
    expect((await other.json(path, 'DELETE')).status).toBe(403);

    // bad patch bodies
    expect((await owner.json(path, 'PATCH', {})).status).toBe(400);
    expect((await owner.json(path, 'PATCH', { visibility: 'public' })).status).toBe(400);
    expect((await owner.json(path, 'PATCH', { userId: 'x' })).status).toBe(400);

    // owner deletes; then it is gone for everyone
    expect((await owner.json(path, 'DELETE')).status).toBe(204);
    expect((await owner.json(path, 'GET')).status).toBe(404);
    expect((await other.json(path, 'GET')).status).toBe(404);
  });

  it('lists answers shared with the club for any member, never private ones', async () => {
    const owner = await signedIn(base, 'member@candlewise.test');
    const librarian = await signedIn(base, 'librarian@candlewise.test');
    const shared = (await owner.json('/api/answers', 'POST', { ...body, visibility: 'club', note: 'for the meeting' })).body;
    const priv = (await owner.json('/api/answers', 'POST', body)).body;
    const list = await librarian.json('/api/answers?scope=club&limit=100', 'GET');
    expect(list.status).toBe(200);
    const ids = list.body.items.map((x: { id: string }) => x.id);
    expect(ids).toContain(shared.id);
    expect(ids).not.toContain(priv.id);
    expect(list.body.items.every((x: { visibility: string }) => x.visibility === 'club')).toBe(true);
    expect(list.body.items.find((x: { id: string }) => x.id === shared.id).askerName).toBe('Wren Alder');
    expect((await anon().json('/api/answers?scope=club', 'GET')).status).toBe(401);
    expect((await librarian.json('/api/answers?scope=everyone', 'GET')).status).toBe(400);
  });

  it('404s ids that do not exist or are malformed', async () => {
    const m = await signedIn(base, 'member@candlewise.test');
    expect((await m.json('/api/answers/AAAAAAAAAAAA', 'GET')).status).toBe(404);
    expect((await m.json('/api/answers/x', 'GET')).status).toBe(404);
    expect((await m.json('/api/answers/%27%20or%201%3D1', 'PATCH', { note: 'x' })).status).toBe(404);
  });
});
