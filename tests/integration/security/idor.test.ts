import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Fixtures, type Account } from './fixtures';
import { evaluateBody, pngBytes, treeBody, uploadPhoto } from './bodies';

// Insecure direct object references: member B knows the ids of member A's private answer, tree
// and photos, and tries to read, change and delete them. Every attempt is a 404 (not yours to
// know about), and A's things are unchanged afterwards.
const base = inject('baseUrl');
const f = new Fixtures(base);

let a: Account;
let b: Account;
const ids = { tree: '', answer: '', treePhoto: '', answerPhoto: '' };

beforeAll(async () => {
  a = await f.newMember('idor-a');
  b = await f.newMember('idor-b');
  const tree = await a.client.json('/api/trees', 'POST', await treeBody(f));
  expect(tree.status, JSON.stringify(tree.body)).toBe(201);
  ids.tree = tree.body.tree.id;
  const answer = await a.client.json('/api/answers', 'POST', { ...(await evaluateBody(f)), treeId: ids.tree, note: 'private note of A' });
  expect(answer.status, JSON.stringify(answer.body)).toBe(201);
  ids.answer = answer.body.id;
  ids.treePhoto = (await uploadPhoto(a.client, { treeId: ids.tree }, await pngBytes())).body.photo.id;
  ids.answerPhoto = (await uploadPhoto(a.client, { answerId: ids.answer }, await pngBytes())).body.photo.id;
});

async function snapshot() {
  return {
    tree: (await a.client.json(`/api/trees/${ids.tree}`, 'GET')).body,
    answer: (await a.client.json(`/api/answers/${ids.answer}`, 'GET')).body,
    treePhoto: (await a.client.get(`/api/uploads/${ids.treePhoto}`)).status,
    answerPhoto: (await a.client.get(`/api/uploads/${ids.answerPhoto}?size=thumb`)).status,
  };
}

describe('another member’s private things, by id', () => {
  it('A can see all of them (control)', async () => {
    const s = await snapshot();
    expect(s.tree.tree.id).toBe(ids.tree);
    expect(s.answer.id).toBe(ids.answer);
    expect(s.treePhoto).toBe(200);
    expect(s.answerPhoto).toBe(200);
  });

  it('B can neither read, change nor delete them, and learns nothing from the answers', async () => {
    const before = await snapshot();
    const attempts: [string, string, unknown?][] = [
      ['GET', `/api/trees/${ids.tree}`],
      ['PATCH', `/api/trees/${ids.tree}`, { name: 'Taken' }],
      ['DELETE', `/api/trees/${ids.tree}`],
      ['GET', `/api/answers/${ids.answer}`],
      ['GET', `/api/answers/${ids.answer}/rerun`],
      ['PATCH', `/api/answers/${ids.answer}`, { visibility: 'club' }],
      ['PATCH', `/api/answers/${ids.answer}`, { note: 'changed by B' }],
      ['DELETE', `/api/answers/${ids.answer}`],
      ['GET', `/api/uploads/${ids.treePhoto}`],
      ['GET', `/api/uploads/${ids.treePhoto}?size=thumb`],
      ['GET', `/api/uploads/${ids.answerPhoto}`],
      ['DELETE', `/api/uploads/${ids.treePhoto}`],
      ['DELETE', `/api/uploads/${ids.answerPhoto}`],
      ['GET', `/api/uploads?treeId=${ids.tree}`],
      ['GET', `/api/uploads?answerId=${ids.answer}`],
      ['GET', `/api/trees/${ids.tree}/plan`],
      ['GET', `/api/trees/${ids.tree}/plan.ics`],
      ['POST', `/api/trees/${ids.tree}/observations`, { task: 'candle-work' }],
    ];
    const failures: string[] = [];
    for (const [method, path, body] of attempts) {
      const r = await b.client.json(path, method, body);
      if (r.status !== 404) failures.push(`${method} ${path}: ${r.status}`);
      const text = JSON.stringify(r.body ?? '');
      if (text.includes('private note of A') || text.includes(a.id)) failures.push(`${method} ${path} leaked A's data`);
    }
    expect(failures).toEqual([]);
    // The same 404 as for an id that exists nowhere.
    const unknown = await b.client.json('/api/trees/tree_doesnotexist0000', 'GET');
    expect(unknown.status).toBe(404);
    expect(await snapshot()).toEqual(before);
  });

  it('B cannot attach things to A’s tree or answer', async () => {
    const png = await pngBytes();
    const toTree = await uploadPhoto(b.client, { treeId: ids.tree }, png);
    const toAnswer = await uploadPhoto(b.client, { answerId: ids.answer }, png);
    expect(toTree.status).toBe(404);
    expect(toAnswer.status).toBe(404);
    const answer = await b.client.json('/api/answers', 'POST', { ...(await evaluateBody(f)), treeId: ids.tree });
    expect([404, 422, 400]).toContain(answer.status);
    expect((await a.client.json(`/api/uploads?treeId=${ids.tree}`, 'GET')).body.items).toHaveLength(1);
  });

  it('B’s lists do not include them', async () => {
    const trees = await b.client.json('/api/trees', 'GET');
    expect(trees.body.items.map((t: { id: string }) => t.id)).not.toContain(ids.tree);
    const own = await b.client.json('/api/answers', 'GET');
    expect(own.body.items.map((x: { id: string }) => x.id)).not.toContain(ids.answer);
    const club = await b.client.json('/api/answers?scope=club', 'GET');
    expect(club.body.items.map((x: { id: string }) => x.id)).not.toContain(ids.answer);
  });

  it('staff roles get no more than B: a private answer is private from editors, librarians and admins too', async () => {
    for (const role of ['editor', 'librarian', 'admin'] as const) {
      const c = await f.client(role);
      expect((await c.json(`/api/answers/${ids.answer}`, 'GET')).status, role).toBe(404);
      expect((await c.json(`/api/trees/${ids.tree}`, 'GET')).status, role).toBe(404);
      expect((await c.json(`/api/trees/${ids.tree}/plan`, 'GET')).status, role).toBe(404);
      expect((await c.get(`/api/trees/${ids.tree}/plan.ics`)).status, role).toBe(404);
      expect((await c.get(`/api/uploads/${ids.treePhoto}`)).status, role).toBe(404);
    }
  });

  it('once A shares the answer, B may read it but still not change or delete it', async () => {
    expect((await a.client.json(`/api/answers/${ids.answer}`, 'PATCH', { visibility: 'club' })).status).toBe(200);
    const seen = await b.client.json(`/api/answers/${ids.answer}`, 'GET');
    expect(seen.status).toBe(200);
    expect([403, 404]).toContain((await b.client.json(`/api/answers/${ids.answer}`, 'PATCH', { note: 'B was here' })).status);
    expect([403, 404]).toContain((await b.client.json(`/api/answers/${ids.answer}`, 'DELETE')).status);
    expect([403, 404]).toContain((await b.client.json(`/api/uploads/${ids.answerPhoto}`, 'DELETE')).status);
    // The tree stays private even though an answer about it is shared.
    expect((await b.client.json(`/api/trees/${ids.tree}`, 'GET')).status).toBe(404);
    expect((await b.client.get(`/api/uploads/${ids.treePhoto}`)).status).toBe(404);
    const after = await a.client.json(`/api/answers/${ids.answer}`, 'GET');
    expect(after.body.note).toBe('private note of A');
    await a.client.json(`/api/answers/${ids.answer}`, 'PATCH', { visibility: 'private' });
    expect((await b.client.json(`/api/answers/${ids.answer}`, 'GET')).status).toBe(404);
  });
});
