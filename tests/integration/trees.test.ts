import { describe, expect, inject, it } from 'vitest';
import { Client, signedIn } from '../support/http-client';

const base = inject('baseUrl');

const tree = {
  name: 'Riverbank Scots',
  speciesSlug: 'pinus-sylvestris',
  stageNotes: 'Primary branches set',
  containerShape: 'rectangle',
  containerLengthCm: 40,
  containerWidthCm: 30,
  acquiredOn: '2024-04-02',
  collectedFromWild: false,
  collectedOn: null,
  notes: '',
};

describe('trees: owner only', () => {
  it('401 for the anonymous on every tree route', async () => {
    const anon = new Client(base);
    expect((await anon.json('/api/trees', 'GET')).status).toBe(401);
    expect((await anon.json('/api/trees', 'POST', tree)).status).toBe(401);
    expect((await anon.json('/api/trees/abcdefgh12345678', 'GET')).status).toBe(401);
    expect((await anon.json('/api/trees/abcdefgh12345678', 'PATCH', { name: 'x' })).status).toBe(401);
    expect((await anon.json('/api/trees/abcdefgh12345678', 'DELETE')).status).toBe(401);
  });

  it('a member creates, reads, edits and deletes a tree; another member gets 404 for all of it', async () => {
    const a = await signedIn(base, 'member@candlewise.test');
    const b = await signedIn(base, 'member2@candlewise.test');
    const created = await a.json('/api/trees', 'POST', tree);
    expect(created.status).toBe(201);
    const id = created.body.tree.id as string;
    expect(id).toMatch(/^[A-Za-z0-9_-]{16}$/);
    expect(created.body.tree).toMatchObject({ name: 'Riverbank Scots', containerShape: 'rectangle', containerWidthCm: 30 });
    expect(created.body.tree.ownerId).toBeUndefined();

    const mine = await a.json('/api/trees', 'GET');
    expect(mine.body.items.map((t: { id: string }) => t.id)).toContain(id);
    const theirs = await b.json('/api/trees', 'GET');
    expect(theirs.status).toBe(200);
    expect(theirs.body.items.map((t: { id: string }) => t.id)).not.toContain(id);

    expect((await b.json(`/api/trees/${id}`, 'GET')).status).toBe(404);
    expect((await b.json(`/api/trees/${id}`, 'PATCH', { name: 'Mine now' })).status).toBe(404);
    expect((await b.json(`/api/trees/${id}`, 'DELETE')).status).toBe(404);
    expect((await b.get(`/trees/${id}`)).status).toBe(404);
    expect((await b.get(`/trees/${id}/edit`)).status).toBe(404);
    // The admin has every club right, but a member's trees stay the member's.
    const admin = await signedIn(base, 'admin@candlewise.test');
    expect((await admin.json(`/api/trees/${id}`, 'GET')).status).toBe(404);

    const page = await a.get(`/trees/${id}`);
    expect(page.status).toBe(200);
    const html = await page.text();
    expect(html).toContain('Riverbank Scots');
    expect(html).toContain('Ask about this tree');
    expect(html).toContain(`/ask?tree=${id}&amp;species=pinus-sylvestris&amp;shape=rectangle&amp;lengthCm=40&amp;widthCm=30&amp;collected=0`);

    const patched = await a.json(`/api/trees/${id}`, 'PATCH', { containerShape: 'round', containerLengthCm: 35 });
    expect(patched.status).toBe(200);
    // A round pot keeps no width.
    expect(patched.body.tree).toMatchObject({ containerShape: 'round', containerLengthCm: 35, containerWidthCm: null, name: 'Riverbank Scots' });

    expect((await a.json(`/api/trees/${id}`, 'DELETE')).status).toBe(204);
    expect((await a.json(`/api/trees/${id}`, 'GET')).status).toBe(404);
  });

  it('bad input is refused with the field at fault, and nothing is created', async () => {
    const a = await signedIn(base, 'member@candlewise.test');
    const before = (await a.json('/api/trees', 'GET')).body.items.length;
    const bad = await a.json('/api/trees', 'POST', { ...tree, name: '', containerWidthCm: null });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['containerWidthCm', 'name']);
    const unknown = await a.json('/api/trees', 'POST', { ...tree, speciesSlug: 'pinus-imaginaria' });
    expect(unknown.status).toBe(422);
    expect(unknown.body.error.fields.speciesSlug).toBeDefined();
    const future = await a.json('/api/trees', 'POST', { ...tree, collectedFromWild: true, collectedOn: '2999-01-01' });
    expect(future.status).toBe(422);
    expect(future.body.error.fields.collectedOn).toBeDefined();
    const notWild = await a.json('/api/trees', 'POST', { ...tree, collectedFromWild: false, collectedOn: '2020-01-01' });
    expect(notWild.status).toBe(422);
    const wrongTypes = await a.json('/api/trees', 'POST', { ...tree, containerLengthCm: '40', collectedFromWild: 'yes' });
    expect(wrongTypes.status).toBe(422);
    expect(Object.keys(wrongTypes.body.error.fields).sort()).toEqual(['collectedFromWild', 'containerLengthCm']);
    const malformed = await a.request('/api/trees', { method: 'POST', headers: { 'content-type': 'application/json' }, body: '{"name":' });
    expect(malformed.status).toBe(400);
    expect((await a.json('/api/trees', 'GET')).body.items.length).toBe(before);

    const { body } = await a.json('/api/trees', 'POST', tree);
    const id = body.tree.id;
    const badPatch = await a.json(`/api/trees/${id}`, 'PATCH', { containerShape: 'oval', containerWidthCm: null });
    expect(badPatch.status).toBe(422);
    expect(badPatch.body.error.fields.containerWidthCm).toBeDefined();
    expect((await a.json(`/api/trees/${id}`, 'PATCH', {})).status).toBe(422);
    expect((await a.json(`/api/trees/${id}`, 'GET')).body.tree.containerShape).toBe('rectangle');
    expect((await a.json('/api/trees/..%2F..%2Fetc', 'GET')).status).toBe(404);
  });

  it('passes the collection history to the wizard link, and due now treats a fresh collection as recovery', async () => {
    const a = await signedIn(base, 'member@candlewise.test');
    const daysAgo = (n: number) => new Date(Date.now() - n * 86_400_000).toISOString().slice(0, 10);
    const wild = { ...tree, containerShape: null, containerLengthCm: null, containerWidthCm: null, collectedFromWild: true };
    const fresh = (await a.json('/api/trees', 'POST', { ...wild, name: 'Hillside collected', collectedOn: daysAgo(100) })).body.tree;
    const html = await (await a.get(`/trees/${fresh.id}`)).text();
    expect(html).toContain(`/ask?tree=${fresh.id}&amp;species=pinus-sylvestris&amp;collected=1&amp;collectedOn=${daysAgo(100)}`);
    expect(html).toMatch(/Recovery stage \(collected from the wild within the last two years\)/);
    // Five years in a container: no longer the recovery case.
    const old = (await a.json('/api/trees', 'POST', { ...wild, name: 'Long settled', collectedOn: daysAgo(5 * 365) })).body.tree;
    const oldHtml = await (await a.get(`/trees/${old.id}`)).text();
    expect(oldHtml).toContain(`collected=0&amp;collectedOn=${daysAgo(5 * 365)}`);
    expect(oldHtml).toContain('Refinement stage (no answer about this tree yet');
  });
});
