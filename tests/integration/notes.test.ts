import { beforeAll, describe, expect, inject, it } from 'vitest';
import { Client, signedIn } from '../support/http-client';

const base = inject('baseUrl');

// The seeded demo content: a shared answer by the demo member and a published note linking it.
const SHARED_ANSWER = 'demoAnsWeirScots1';
const SEEDED_NOTE = '2026-04-18-spring-candle-evening';

let member: Client;
let librarian: Client;
let admin: Client;
let editor: Client;
let privateAnswer: string;

async function saveAnswer(c: Client, visibility: 'private' | 'club') {
  const r = await c.json('/api/answers', 'POST', {
    species: 'pinus-sylvestris',
    branching: 'tertiary',
    date: '2026-05-02',
    hemisphere: 'north',
    shoot: 'candle-extending',
    position: 'beyond-silhouette',
    health: 'strong',
    visibility,
  });
  expect(r.status).toBe(201);
  return r.body.id as string;
}

async function outboxFor(email: string, subjectPart: string, attempts = 60) {
  for (let i = 0; i < attempts; i++) {
    const { body } = await admin.json('/api/outbox?limit=200', 'GET');
    const found = body.items.filter((m: { to: string[]; subject: string }) => m.to.includes(email) && m.subject.includes(subjectPart));
    if (found.length) return found;
    await new Promise((r) => setTimeout(r, 100));
  }
  return [];
}

beforeAll(async () => {
  member = await signedIn(base, 'member@candlewise.test');
  librarian = await signedIn(base, 'librarian@candlewise.test');
  admin = await signedIn(base, 'admin@candlewise.test');
  editor = await signedIn(base, 'editor@candlewise.test');
  privateAnswer = await saveAnswer(member, 'private');
});

const draft = (title: string, body = '') => ({ title, meetingDate: '2026-11-07', body, status: 'draft' });

describe('notes: roles', () => {
  it('the anonymous get 401 everywhere, members and editors 403 on every write', async () => {
    const anon = new Client(base);
    expect((await anon.json('/api/notes', 'GET')).status).toBe(401);
    expect((await anon.json(`/api/notes/${SEEDED_NOTE}`, 'GET')).status).toBe(401);
    expect((await anon.json('/api/notes', 'POST', draft('x'))).status).toBe(401);
    expect((await anon.get('/notes')).status).toBe(307);
    for (const c of [member, editor]) {
      expect((await c.json('/api/notes', 'POST', draft('Not mine to write'))).status).toBe(403);
      expect((await c.json(`/api/notes/${SEEDED_NOTE}`, 'PATCH', { title: 'Hijacked' })).status).toBe(403);
      expect((await c.json(`/api/notes/${SEEDED_NOTE}`, 'DELETE')).status).toBe(403);
      expect((await c.json(`/api/notes/${SEEDED_NOTE}/send`, 'POST', {})).status).toBe(403);
      expect((await c.json(`/api/notes/${SEEDED_NOTE}/send`, 'GET')).status).toBe(403);
      expect((await c.json('/api/notes/preview', 'POST', { body: 'x' })).status).toBe(403);
      expect((await c.json('/api/notes/linkable-answers', 'GET')).status).toBe(403);
      expect((await c.get('/notes/new')).status).toBe(403);
      expect((await c.get(`/notes/${SEEDED_NOTE}/edit`)).status).toBe(403);
    }
    expect((await member.json(`/api/notes/${SEEDED_NOTE}`, 'GET')).body.note.title).toBe('Spring candle evening');
  });

  it('a librarian writes, edits and deletes; members never see a draft', async () => {
    const created = await librarian.json('/api/notes', 'POST', draft('Wiring clinic', 'Bring **copper** wire.'));
    expect(created.status).toBe(201);
    const slug = created.body.note.slug;
    expect(slug).toBe('2026-11-07-wiring-clinic');
    expect((await member.json(`/api/notes/${slug}`, 'GET')).status).toBe(404);
    expect((await member.get(`/notes/${slug}`)).status).toBe(404);
    expect((await member.json('/api/notes', 'GET')).body.items.map((n: { slug: string }) => n.slug)).not.toContain(slug);
    expect((await librarian.json('/api/notes', 'GET')).body.items.map((n: { slug: string }) => n.slug)).toContain(slug);

    const published = await librarian.json(`/api/notes/${slug}`, 'PATCH', { status: 'published', expectedUpdatedAt: created.body.note.updatedAt });
    expect(published.status).toBe(200);
    expect(published.body.note.publishedAt).toBeTruthy();
    const stale = await librarian.json(`/api/notes/${slug}`, 'PATCH', { body: 'late', expectedUpdatedAt: created.body.note.updatedAt });
    expect(stale.status).toBe(409);
    const got = await member.json(`/api/notes/${slug}`, 'GET');
    expect(got.status).toBe(200);
    expect(got.body.html).toContain('<strong>copper</strong>');

    const md = await member.get(`/api/notes/${slug}?format=md`);
    expect(md.headers.get('content-type')).toContain('text/markdown');
    expect(md.headers.get('content-disposition')).toBe(`attachment; filename="${slug}.md"`);
    const text = await md.text();
    expect(text).toMatch(/^---\ntitle: Wiring clinic\nmeetingDate: "?2026-11-07"?\n/);
    expect(text).toContain('Bring **copper** wire.');

    expect((await admin.json(`/api/notes/${slug}`, 'PATCH', { title: 'Wiring clinic (revised)' })).status).toBe(200);
    expect((await admin.json(`/api/notes/${slug}`, 'DELETE')).status).toBe(204);
    expect((await librarian.json(`/api/notes/${slug}`, 'GET')).status).toBe(404);
  });

  it('bad input names the field; unknown slugs are 404', async () => {
    const bad = await librarian.json('/api/notes', 'POST', { title: '', meetingDate: '14/03/2027', body: 'x', status: 'live' });
    expect(bad.status).toBe(422);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['meetingDate', 'status', 'title']);
    expect((await librarian.json('/api/notes/2099-01-01-nothing', 'GET')).status).toBe(404);
    expect((await librarian.json('/api/notes/..%2F..%2Fetc', 'GET')).status).toBe(404);
    expect((await librarian.json(`/api/notes/${SEEDED_NOTE}`, 'PATCH', {})).status).toBe(422);
    expect((await librarian.json('/api/notes?status=secret', 'GET')).status).toBe(400);
  });
});

describe('notes: links, previews and backlinks', () => {
  it('a shared answer is a card, a private or missing one plain text, for every reader', async () => {
    const body = `Shared: [ok](/answers/${SHARED_ANSWER}). Private: [hidden](/answers/${privateAnswer}). Gone: [gone](/answers/nonexistent0001).`;
    const { body: created } = await librarian.json('/api/notes', 'POST', { ...draft('Link check', body), status: 'published' });
    for (const c of [member, librarian, await signedIn(base, 'member2@candlewise.test')]) {
      const { body: got } = await c.json(`/api/notes/${created.note.slug}`, 'GET');
      expect(got.html).toContain(`href="/answers/${SHARED_ANSWER}"`);
      expect(got.html).toContain('asked by Wren Alder');
      expect(got.html).not.toContain(privateAnswer);
      expect(got.html).not.toContain('nonexistent0001');
      expect(got.html.match(/link-unavailable/g)?.length).toBe(2);
    }
    const preview = await librarian.json('/api/notes/preview', 'POST', { body });
    expect(preview.body.html).not.toContain(privateAnswer);
    expect(preview.body.html).toContain('asked by Wren Alder');
  });

  it('the picker lists shared answers only', async () => {
    const { body } = await librarian.json('/api/notes/linkable-answers?species=scots', 'GET');
    const ids = body.items.map((a: { id: string }) => a.id);
    expect(ids).toContain(SHARED_ANSWER);
    expect(ids).not.toContain(privateAnswer);
    // Enough to tell lookalike answers apart: the member, the tree and when it was saved.
    expect(body.items.find((a: { id: string }) => a.id === SHARED_ANSWER)).toMatchObject({
      askerName: 'Wren Alder',
      treeName: 'Weir-side Scots',
      savedAt: expect.stringMatching(/^\d{4}-\d\d-\d\dT\d\d:\d\d/),
    });
    expect((await librarian.json('/api/notes/linkable-answers?from=2026-13-01', 'GET')).status).toBe(400);
  });

  it('search finds a published note by its title for a member', async () => {
    const { body } = await librarian.json('/api/notes', 'POST', { ...draft('Backlink meeting'), meetingDate: '2026-03-14', status: 'published' });
    const search = await member.json('/api/notes?q=backlink', 'GET');
    expect(search.body.items.map((n: { slug: string }) => n.slug)).toEqual([body.note.slug]);
  });
});

describe('e-mail digest', () => {
  it('refuses a draft, sends a published note to opted-in members, asks before a second send', async () => {
    const { body: d } = await librarian.json('/api/notes', 'POST', draft('Digest draft'));
    expect((await librarian.json(`/api/notes/${d.note.slug}/send`, 'POST', {})).status).toBe(409);

    const { body } = await librarian.json('/api/notes', 'POST', {
      ...draft('Digest evening', `We discussed [this pinch](/answers/${SHARED_ANSWER}) and [that one](/answers/${privateAnswer}).`),
      status: 'published',
    });
    const slug = body.note.slug;
    const status = await librarian.json(`/api/notes/${slug}/send`, 'GET');
    expect(status.body).toMatchObject({ sends: [], published: true });
    const optedIn = status.body.optedIn;
    expect(optedIn).toBeGreaterThanOrEqual(3); // member, editor, librarian opt in in the demo data

    // The preview: the mail as a member gets it, the recipient count, and nothing sent.
    const preview = await librarian.json(`/api/notes/${slug}/send?preview=1`, 'GET');
    expect(preview.status).toBe(200);
    expect(preview.body).toMatchObject({ recipients: optedIn, published: true, subject: expect.stringContaining('Digest evening') });
    expect(preview.body.html).toContain('asked by Wren Alder');
    expect(preview.body.html).not.toContain(privateAnswer);
    expect(preview.body.html).toMatch(/href="http[^"]+\/unsubscribe\?token=/);
    expect(preview.body.text).toContain('Stop them: http');
    expect((await librarian.json(`/api/notes/${slug}/send`, 'GET')).body.sends).toEqual([]);
    expect(await outboxFor('member@candlewise.test', 'Digest evening', 1)).toHaveLength(0);

    const first = await librarian.json(`/api/notes/${slug}/send`, 'POST', {});
    expect(first.status).toBe(201);
    expect(first.body.recipients).toBe(optedIn);

    const mails = await outboxFor('member@candlewise.test', 'Digest evening');
    expect(mails).toHaveLength(1);
    const m = mails[0];
    expect(m.html).toContain('asked by Wren Alder');
    expect(m.html).not.toContain(privateAnswer);
    expect(m.text).toContain('Digest evening');
    expect(m.text).not.toContain(privateAnswer);
    // The copies go out through the job queue, one job per opted-in member: by the time the
    // member's copy is stored, no job was ever queued for member2, who did not opt in.
    expect(await outboxFor('member2@candlewise.test', 'Digest evening', 1)).toHaveLength(0);

    const second = await librarian.json(`/api/notes/${slug}/send`, 'POST', {});
    expect(second.status).toBe(409);
    expect(second.body.error.code).toBe('conflict:digest_already_sent');
    expect(second.body.error.previous.sentAt).toBe(first.body.sentAt);
    expect(second.body.error.previous.recipients).toBe(optedIn);
    const confirmed = await librarian.json(`/api/notes/${slug}/send`, 'POST', { confirm: true });
    expect(confirmed.status).toBe(201);
    const sends = (await librarian.json(`/api/notes/${slug}/send`, 'GET')).body.sends;
    expect(sends).toHaveLength(2);
    expect(sends[0].senderName).toBe('Marla Quayle');
    expect((await librarian.json(`/api/notes/${slug}/send`, 'POST', { confirm: 'yes' })).status).toBe(422);
  });

  it('the unsubscribe link from the mail works without signing in, once; a tampered one does not', async () => {
    const { body } = await librarian.json('/api/notes', 'POST', { ...draft('Unsubscribe evening'), status: 'published' });
    await librarian.json(`/api/notes/${body.note.slug}/send`, 'POST', {});
    const [m] = await outboxFor('editor@candlewise.test', 'Unsubscribe evening');
    const link = (m.text as string).match(/https?:\/\/\S+\/unsubscribe\?token=\S+/)![0];
    const token = new URL(link).searchParams.get('token')!;

    const anon = new Client(base);
    const page = await anon.get(new URL(link).pathname + new URL(link).search);
    expect(page.status).toBe(200);
    expect(await page.text()).toContain('Stop these e-mails');

    const [p, mac] = token.split('.');
    const tampered = `${p}.${mac.slice(0, -2)}${mac.slice(-2) === 'AA' ? 'BB' : 'AA'}`;
    const refused = await anon.json('/api/unsubscribe', 'POST', { token: tampered });
    expect(refused.status).toBe(400);
    expect(refused.body.error.fields.token).toBeDefined();
    expect((await anon.json('/api/unsubscribe', 'POST', {})).status).toBe(400);

    const ok = await anon.json('/api/unsubscribe', 'POST', { token });
    expect(ok.status).toBe(200);
    expect(ok.body.email).toBe('editor@candlewise.test');
    const profile = await editor.json('/api/me', 'GET');
    expect(JSON.stringify(profile.body)).toContain('"digestOptIn":false');

    const { body: n2 } = await librarian.json('/api/notes', 'POST', { ...draft('After unsubscribing'), status: 'published' });
    await librarian.json(`/api/notes/${n2.note.slug}/send`, 'POST', {});
    await outboxFor('member@candlewise.test', 'After unsubscribing');
    expect(await outboxFor('editor@candlewise.test', 'After unsubscribing', 1)).toHaveLength(0);
    // Put the demo account back as it was.
    await editor.json('/api/me', 'PATCH', { digestOptIn: true });
  });
});
