import { beforeAll, describe, expect, it } from 'vitest';
import { memoryDb } from '../support/memory-db';
import { eq } from 'drizzle-orm';
import { answers, noteLinks } from '@/db/schema';
import { createNote, deleteNote, getBacklinks, getNote, listNotes, updateNote } from '@/lib/data/notes';
import { renderNoteBody, resolveNoteLinks, UNAVAILABLE_ANSWER, UNKNOWN_SPECIES } from '@/lib/data/note-render';
import { searchLinkableAnswers } from '@/lib/data/linkable-answers';
import { extractInternalLinks, parseInternalLink } from '@/lib/markdown/render';
import { noteSlugFor, formatMeetingDate } from '@/lib/validation/notes';
import type { SessionUser } from '@/lib/auth/session';
import type { WizardInput, WizardResult } from '@/lib/wizard/types';
import { AppError } from '@/lib/errors';

const mem = memoryDb({ record: false });
let librarian: SessionUser;
let member: SessionUser;
let member2: SessionUser;

const SHARED = 'sharedAns0001';
const PRIVATE = 'privateAns001';
const MISSING = 'missingAns001';

async function addAnswer(id: string, userId: string, visibility: 'private' | 'club', observedOn = '2027-05-10', action = 'pinch') {
  await mem.db.insert(answers).values({
    id,
    userId,
    speciesSlug: 'pinus-sylvestris',
    speciesRevision: 1,
    engineVersion: 'test',
    action,
    stage: 'refinement',
    season: 'spring',
    observedOn,
    input: { species: 'pinus-sylvestris' } as WizardInput,
    result: { speciesName: 'Scots pine' } as WizardResult,
    visibility,
  });
}

beforeAll(async () => {
  librarian = await mem.user('librarian@candlewise.test');
  member = await mem.user('member@candlewise.test');
  member2 = await mem.user('member2@candlewise.test');
  await addAnswer(SHARED, member.id, 'club');
  await addAnswer(PRIVATE, member.id, 'private');
  await addAnswer('sharedAns0002', member2.id, 'club', '2027-08-02', 'prune');
});

const rejectsWith = async (p: Promise<unknown>, status: number) => {
  const e = await p.then(
    () => null,
    (x) => x,
  );
  expect(e).toBeInstanceOf(AppError);
  expect((e as AppError).status).toBe(status);
};

describe('link recognition', () => {
  it('recognises answer and species paths, relative or on this site only', () => {
    expect(parseInternalLink('/answers/sharedAns0001')).toEqual({ type: 'answer', id: 'sharedAns0001' });
    expect(parseInternalLink('/answers/sharedAns0001/')).toEqual({ type: 'answer', id: 'sharedAns0001' });
    expect(parseInternalLink('/species/pinus-sylvestris')).toEqual({ type: 'species', slug: 'pinus-sylvestris' });
    expect(parseInternalLink('https://evil.example/answers/sharedAns0001')).toBeNull();
    expect(parseInternalLink('/answers/../users')).toBeNull();
    expect(parseInternalLink('/species/Pinus_sylvestris')).toBeNull();
    expect(extractInternalLinks(`See [a](/answers/${SHARED}), [b][ref] and [c](/species/pinus-mugo).\n\n[ref]: /answers/${PRIVATE}`)).toEqual([
      { type: 'answer', id: SHARED },
      { type: 'species', slug: 'pinus-mugo' },
      { type: 'answer', id: PRIVATE },
    ]);
  });
});

describe('preview resolution', () => {
  it('a shared answer becomes a card with action, species, date and asker', async () => {
    const res = await resolveNoteLinks(`[the pinch](/answers/${SHARED})`);
    expect(res.get(`a:${SHARED}`)).toEqual({ state: 'card', meta: 'Pinch · Scots pine · 10 May 2027 · asked by Wren Alder' });
    const html = await renderNoteBody(`[the pinch](/answers/${SHARED})`);
    expect(html).toContain(`<a href="/answers/${SHARED}" class="internal-link internal-answer link-card">`);
    expect(html).toContain('asked by Wren Alder');
  });

  it('a private answer and a missing one render alike as plain text with a note, leaking nothing', async () => {
    const html = await renderNoteBody(`[mine](/answers/${PRIVATE}) and [gone](/answers/${MISSING})`);
    expect(html).not.toContain(PRIVATE);
    expect(html).not.toContain(MISSING);
    expect(html).not.toContain('<a');
    expect(html).not.toContain('Wren Alder');
    expect(html).toContain(`<span class="link-unavailable">mine <span class="link-note">${UNAVAILABLE_ANSWER}</span></span>`);
    expect(html).toContain(`<span class="link-unavailable">gone <span class="link-note">${UNAVAILABLE_ANSWER}</span></span>`);
  });

  it('stays private even though its owner or a librarian renders it (the note is read by the club)', async () => {
    // The renderer takes no viewer at all: the same body gives the same HTML for everyone.
    const a = await renderNoteBody(`[x](/answers/${PRIVATE})`);
    expect(a).toContain(UNAVAILABLE_ANSWER);
  });

  it('a species becomes a card with name and flush habit; an unknown one plain text', async () => {
    const html = await renderNoteBody('[Black pine](/species/pinus-thunbergii) and [nope](/species/pinus-imaginaria)');
    // common practice, no published source: Japanese black pine is a double-flush pine
    expect(html).toContain('Japanese black pine (Pinus thunbergii) · double flush');
    expect(html).toContain(`nope <span class="link-note">${UNKNOWN_SPECIES}</span>`);
  });

  it('keeps the sanitizer: script in the link text or the body does not survive', async () => {
    const html = await renderNoteBody(`[<img src=x onerror=alert(1)>](/answers/${SHARED}) <script>alert(1)</script> [j](javascript:alert(1))`);
    expect(html).not.toMatch(/<script|onerror|javascript:/i);
  });
});

describe('notes and backlinks', () => {
  it('only librarians and admins write; members see published notes only', async () => {
    await rejectsWith(createNote(member, { title: 'X', meetingDate: '2027-03-14', body: '', status: 'draft' }), 403);
    const draft = await createNote(librarian, { title: 'Spring candle workshop', meetingDate: '2027-03-14', body: 'draft text', status: 'draft' });
    expect(draft.slug).toBe('2027-03-14-spring-candle-workshop');
    expect(draft.authorName).toBe('Marla Quayle');
    await rejectsWith(getNote(member, draft.slug), 404);
    expect((await listNotes(member)).map((n) => n.slug)).not.toContain(draft.slug);
    expect((await listNotes(librarian)).map((n) => n.slug)).toContain(draft.slug);
    await rejectsWith(updateNote(member, draft.slug, { title: 'Hijack' }), 403);
    await rejectsWith(deleteNote(member, draft.slug), 403);
    const again = await createNote(librarian, { title: 'Spring candle workshop', meetingDate: '2027-03-14', body: '', status: 'draft' });
    expect(again.slug).toBe('2027-03-14-spring-candle-workshop-2');
  });

  it('rewrites note_links on every save; backlinks list published notes only', async () => {
    const n = await createNote(librarian, {
      title: 'Pinching night',
      meetingDate: '2027-05-20',
      status: 'draft',
      body: `We looked at [this](/answers/${SHARED}) and [Scots](/species/pinus-sylvestris), twice: [again](/species/pinus-sylvestris).`,
    });
    const rows = await mem.db.select({ t: noteLinks.targetType, id: noteLinks.targetId }).from(noteLinks).where(eq(noteLinks.noteId, n.id));
    expect(rows.sort((a, b) => a.t.localeCompare(b.t))).toEqual([
      { t: 'answer', id: SHARED },
      { t: 'species', id: 'pinus-sylvestris' },
    ]);
    // A draft is not yet "discussed at a meeting".
    expect(await getBacklinks('answer', SHARED)).toEqual([]);

    await updateNote(librarian, n.slug, { status: 'published' });
    expect(await getBacklinks('answer', SHARED)).toEqual([{ slug: n.slug, title: 'Pinching night', meetingDate: '2027-05-20' }]);
    expect((await getBacklinks('species', 'pinus-sylvestris')).map((b) => b.slug)).toEqual([n.slug]);
    expect(formatMeetingDate('2027-05-20')).toBe('20 May 2027');

    await updateNote(librarian, n.slug, { body: 'Now only [mugo](/species/pinus-mugo).' });
    expect(await getBacklinks('answer', SHARED)).toEqual([]);
    expect(await getBacklinks('species', 'pinus-sylvestris')).toEqual([]);
    expect((await getBacklinks('species', 'pinus-mugo')).map((b) => b.slug)).toEqual([n.slug]);

    await updateNote(librarian, n.slug, { status: 'draft' });
    expect(await getBacklinks('species', 'pinus-mugo')).toEqual([]);
    await updateNote(librarian, n.slug, { status: 'published' });
    await deleteNote(librarian, n.slug);
    expect(await getBacklinks('species', 'pinus-mugo')).toEqual([]);
  });

  it('refuses a stale edit with 409', async () => {
    const n = await createNote(librarian, { title: 'Stale', meetingDate: '2027-06-01', body: '', status: 'draft' });
    await updateNote(librarian, n.slug, { body: 'first', expectedUpdatedAt: n.updatedAt });
    await rejectsWith(updateNote(librarian, n.slug, { body: 'second', expectedUpdatedAt: n.updatedAt }), 409);
    expect((await getNote(librarian, n.slug)).body).toBe('first');
  });

  it('searches notes by title, words and author', async () => {
    await createNote(librarian, { title: 'Autumn feeding', meetingDate: '2027-10-02', body: 'Pellets halfway between trunk and rim.', status: 'published' });
    expect((await listNotes(member, { q: 'halfway' })).map((n) => n.title)).toEqual(['Autumn feeding']);
    expect((await listNotes(member, { q: 'autumn' })).map((n) => n.title)).toEqual(['Autumn feeding']);
    expect((await listNotes(member, { q: 'quayle' })).map((n) => n.title)).toContain('Autumn feeding');
    expect(await listNotes(member, { q: '%' })).toEqual([]);
  });

  it('the picker finds shared answers only, by species, action, member and date', async () => {
    await rejectsWith(searchLinkableAnswers(member, {}), 403);
    const all = await searchLinkableAnswers(librarian, {});
    expect(all.map((a) => a.id).sort()).toEqual([SHARED, 'sharedAns0002'].sort());
    expect((await searchLinkableAnswers(librarian, { action: 'prune' })).map((a) => a.id)).toEqual(['sharedAns0002']);
    expect((await searchLinkableAnswers(librarian, { member: 'tamsin' })).map((a) => a.id)).toEqual(['sharedAns0002']);
    expect((await searchLinkableAnswers(librarian, { species: 'scots', to: '2027-06-01' })).map((a) => a.id)).toEqual([SHARED]);
    expect((await searchLinkableAnswers(librarian, { from: '2027-06-01' })).map((a) => a.id)).toEqual(['sharedAns0002']);
  });

  it('makes slugs from the date and title', () => {
    expect(noteSlugFor('2027-03-14', 'Décandling — the Black Pine way!')).toBe('2027-03-14-decandling-the-black-pine-way');
    expect(noteSlugFor('2027-03-14', '!!!')).toBe('2027-03-14');
  });
});
