import { evaluateBody, pngBytes, treeBody } from './bodies';
import {
  currentSpecies, matrixSpecies, newAnswer, newNote, newPhoto, newTree, ownAnswer, ownPhoto, ownTree, publishedNote,
  speciesCreateBody, speciesMarkdown, uniqueLetters,
} from './club-fixtures';
import type { Fixtures } from './fixtures';
import { atLeast, every, pageAtLeast, pageSignedIn, signedIn, type RouteRow } from './matrix-types';

// Rows of the species knowledge base, the wizard, the answer log and the club record.
// Objects a row changes or removes are made fresh for each request; "own" objects belong to the
// actor (the anonymous name the member's).

const photoForm = (treeId: string) => async () => {
  const form = new FormData();
  form.set('treeId', treeId);
  form.set('file', new Blob([new Uint8Array(await pngBytes())], { type: 'image/png' }), 'shoot.png');
  return form;
};

async function speciesPatch(f: Fixtures) {
  const slug = await matrixSpecies(f);
  const s = await currentSpecies(f, slug);
  return { path: `/api/species/${slug}`, json: { record: s.record, body: s.body, summary: 'matrix edit', publish: true, baseRevision: s.revision } };
}

export const clubRows: RouteRow[] = [
  // The wizard and the answer log
  {
    route: 'POST /api/wizard/evaluate', file: 'app/api/wizard/evaluate/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: async (f) => ({ path: '/api/wizard/evaluate', json: await evaluateBody(f) }), expect: every(200), fuzz: { as: 'anonymous' },
  },
  { route: 'GET /api/wizard/offline-data', file: 'app/api/wizard/offline-data/route.ts', method: 'GET', kind: 'api', body: 'none', request: () => ({ path: '/api/wizard/offline-data' }), expect: every(200) },
  { route: 'GET /api/answers', file: 'app/api/answers/route.ts', method: 'GET', kind: 'api', body: 'none', request: () => ({ path: '/api/answers?limit=5' }), expect: signedIn(200) },
  {
    route: 'POST /api/answers', file: 'app/api/answers/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: async (f) => ({ path: '/api/answers', json: { ...(await evaluateBody(f)), note: 'matrix' } }), expect: signedIn(201), fuzz: { as: 'member' },
  },
  { route: 'GET /api/answers/[id]', file: 'app/api/answers/[id]/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f, a) => ({ path: `/api/answers/${await ownAnswer(f, a)}` }), expect: signedIn(200) },
  {
    route: 'PATCH /api/answers/[id]', file: 'app/api/answers/[id]/route.ts', method: 'PATCH', kind: 'api', body: 'json',
    request: async (f, a) => ({ path: `/api/answers/${await ownAnswer(f, a)}`, json: { followUp: 'Checked a month later: back buds formed.' } }), expect: signedIn(200), fuzz: { as: 'member' },
  },
  { route: 'DELETE /api/answers/[id]', file: 'app/api/answers/[id]/route.ts', method: 'DELETE', kind: 'api', body: 'none', request: async (f, a) => ({ path: `/api/answers/${await newAnswer(f, a)}` }), expect: signedIn(204) },
  { route: 'GET /api/answers/[id]/rerun', file: 'app/api/answers/[id]/rerun/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f, a) => ({ path: `/api/answers/${await ownAnswer(f, a)}/rerun` }), expect: signedIn(200) },

  // The season
  {
    route: 'POST /api/season/degree-days', file: 'app/api/season/degree-days/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: () => ({ path: '/api/season/degree-days', json: { base: 5, days: [{ date: '2027-03-01', tmin: 2, tmax: 11 }, { date: '2027-03-02', tmin: 8, tmax: 22 }] } }),
    expect: every(200), fuzz: { as: 'anonymous' },
  },

  {
    route: 'POST /api/season/records/preview', file: 'app/api/season/records/preview/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: () => ({ path: '/api/season/records/preview', json: { scope: 'club', csv: 'date,tmin,tmax\n2026-04-01,2,11\n' } }), expect: atLeast('librarian', 200), fuzz: { as: 'librarian' },
  },
  {
    route: 'POST /api/season/records/import', file: 'app/api/season/records/import/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: () => ({ path: '/api/season/records/import', json: { scope: 'club', csv: 'date,tmin,tmax\n2026-04-01,2,11\n' } }), expect: atLeast('librarian', 201), fuzz: { as: 'librarian' },
  },
  { route: 'GET /api/trees/[id]/plan', file: 'app/api/trees/[id]/plan/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f, a) => ({ path: `/api/trees/${await ownTree(f, a)}/plan` }), expect: signedIn(200) },
  { route: 'GET /api/trees/[id]/plan.ics', file: 'app/api/trees/[id]/plan.ics/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f, a) => ({ path: `/api/trees/${await ownTree(f, a)}/plan.ics` }), expect: signedIn(200) },
  {
    route: 'POST /api/trees/[id]/observations', file: 'app/api/trees/[id]/observations/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: async (f, a) => ({ path: `/api/trees/${await ownTree(f, a)}/observations`, json: { shoot: 'candle-extending' } }), expect: signedIn(201), fuzz: { as: 'member' },
  },

  // Species
  { route: 'GET /api/species', file: 'app/api/species/route.ts', method: 'GET', kind: 'api', body: 'none', request: () => ({ path: '/api/species?q=pine&limit=5' }), expect: every(200) },
  {
    route: 'POST /api/species', file: 'app/api/species/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: async (f) => ({ path: '/api/species', json: await speciesCreateBody(f) }), expect: atLeast('editor', 201), fuzz: { as: 'editor' },
  },
  { route: 'GET /api/species/[slug]', file: 'app/api/species/[slug]/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f) => ({ path: `/api/species/${await matrixSpecies(f)}` }), expect: every(200) },
  {
    route: 'PATCH /api/species/[slug]', file: 'app/api/species/[slug]/route.ts', method: 'PATCH', kind: 'api', body: 'json',
    request: (f) => speciesPatch(f), expect: atLeast('editor', 200), fuzz: { as: 'editor' },
  },
  { route: 'GET /api/species/[slug]/revisions', file: 'app/api/species/[slug]/revisions/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f) => ({ path: `/api/species/${await matrixSpecies(f)}/revisions` }), expect: signedIn(200) },
  {
    route: 'POST /api/species/[slug]/revert', file: 'app/api/species/[slug]/revert/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: async (f) => {
      const slug = await matrixSpecies(f);
      const s = await currentSpecies(f, slug);
      return { path: `/api/species/${slug}/revert`, json: { toRevision: 1, baseRevision: s.revision, summary: 'matrix revert', publish: true } };
    },
    expect: atLeast('editor', 201), fuzz: { as: 'editor' },
  },
  { route: 'GET /api/species/[slug]/export', file: 'app/api/species/[slug]/export/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f) => ({ path: `/api/species/${await matrixSpecies(f)}/export` }), expect: every(200) },
  { route: 'GET /api/species/export', file: 'app/api/species/export/route.ts', method: 'GET', kind: 'api', body: 'none', request: () => ({ path: '/api/species/export' }), expect: every(200) },
  {
    route: 'POST /api/species/import/preview', file: 'app/api/species/import/preview/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: async (f) => {
      const slug = `pinus-${uniqueLetters()}`;
      return { path: '/api/species/import/preview', json: { files: [{ name: `${slug}.md`, content: await speciesMarkdown(f, slug) }] } };
    },
    expect: atLeast('editor', 200), fuzz: { as: 'editor' },
  },
  {
    route: 'POST /api/species/import', file: 'app/api/species/import/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: async (f) => {
      const slug = `pinus-${uniqueLetters()}`;
      return { path: '/api/species/import', json: { files: [{ name: `${slug}.md`, content: await speciesMarkdown(f, slug) }], summary: 'matrix import', publish: false } };
    },
    expect: atLeast('editor', 201), fuzz: { as: 'editor' },
  },

  // Trees and photos
  { route: 'GET /api/trees', file: 'app/api/trees/route.ts', method: 'GET', kind: 'api', body: 'none', request: () => ({ path: '/api/trees' }), expect: signedIn(200) },
  {
    route: 'POST /api/trees', file: 'app/api/trees/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: async (f) => ({ path: '/api/trees', json: await treeBody(f, 'Matrix pine') }), expect: signedIn(201), fuzz: { as: 'member' },
  },
  { route: 'GET /api/trees/[id]', file: 'app/api/trees/[id]/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f, a) => ({ path: `/api/trees/${await ownTree(f, a)}` }), expect: signedIn(200) },
  {
    route: 'PATCH /api/trees/[id]', file: 'app/api/trees/[id]/route.ts', method: 'PATCH', kind: 'api', body: 'json',
    request: async (f, a) => ({ path: `/api/trees/${await ownTree(f, a)}`, json: { stageNotes: 'Refinement; second flush expected.' } }), expect: signedIn(200), fuzz: { as: 'member' },
  },
  { route: 'DELETE /api/trees/[id]', file: 'app/api/trees/[id]/route.ts', method: 'DELETE', kind: 'api', body: 'none', request: async (f, a) => ({ path: `/api/trees/${await newTree(f, a)}` }), expect: signedIn(204) },
  { route: 'GET /api/uploads', file: 'app/api/uploads/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f, a) => ({ path: `/api/uploads?treeId=${await ownTree(f, a)}` }), expect: signedIn(200) },
  {
    route: 'POST /api/uploads', file: 'app/api/uploads/route.ts', method: 'POST', kind: 'api', body: 'multipart',
    request: async (f, a) => ({ path: '/api/uploads', multipart: photoForm(await newTree(f, a)) }), expect: signedIn(201),
  },
  { route: 'GET /api/uploads/[id]', file: 'app/api/uploads/[id]/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f, a) => ({ path: `/api/uploads/${await ownPhoto(f, a)}?size=thumb` }), expect: signedIn(200) },
  { route: 'DELETE /api/uploads/[id]', file: 'app/api/uploads/[id]/route.ts', method: 'DELETE', kind: 'api', body: 'none', request: async (f, a) => ({ path: `/api/uploads/${await newPhoto(f, a)}` }), expect: signedIn(204) },

  // Meeting notes and digests
  { route: 'GET /api/notes', file: 'app/api/notes/route.ts', method: 'GET', kind: 'api', body: 'none', request: () => ({ path: '/api/notes' }), expect: signedIn(200) },
  {
    route: 'POST /api/notes', file: 'app/api/notes/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: () => ({ path: '/api/notes', json: { title: `Matrix note ${uniqueLetters()}`, meetingDate: '2026-10-10', body: 'Notes of the **meeting**.', status: 'draft' } }),
    expect: atLeast('librarian', 201), fuzz: { as: 'librarian' },
  },
  { route: 'GET /api/notes/[slug]', file: 'app/api/notes/[slug]/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f) => ({ path: `/api/notes/${await publishedNote(f)}` }), expect: signedIn(200) },
  {
    route: 'PATCH /api/notes/[slug]', file: 'app/api/notes/[slug]/route.ts', method: 'PATCH', kind: 'api', body: 'json',
    request: async (f) => ({ path: `/api/notes/${await publishedNote(f)}`, json: { body: 'We looked at candles on the **black pines**, again.' } }),
    expect: atLeast('librarian', 200), fuzz: { as: 'librarian' },
  },
  { route: 'DELETE /api/notes/[slug]', file: 'app/api/notes/[slug]/route.ts', method: 'DELETE', kind: 'api', body: 'none', request: async (f) => ({ path: `/api/notes/${await newNote(f, 'draft')}` }), expect: atLeast('librarian', 204) },
  { route: 'GET /api/notes/[slug]/send', file: 'app/api/notes/[slug]/send/route.ts', method: 'GET', kind: 'api', body: 'none', request: async (f) => ({ path: `/api/notes/${await publishedNote(f)}/send` }), expect: atLeast('librarian', 200) },
  {
    route: 'POST /api/notes/[slug]/send', file: 'app/api/notes/[slug]/send/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: async (f) => ({ path: `/api/notes/${await newNote(f)}/send`, json: {} }), expect: atLeast('librarian', 201), fuzz: { as: 'librarian' },
  },
  { route: 'GET /api/notes/linkable-answers', file: 'app/api/notes/linkable-answers/route.ts', method: 'GET', kind: 'api', body: 'none', request: () => ({ path: '/api/notes/linkable-answers?action=pinch' }), expect: atLeast('librarian', 200) },
  {
    route: 'POST /api/notes/preview', file: 'app/api/notes/preview/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: () => ({ path: '/api/notes/preview', json: { body: '# Preview\n\nA [link](https://example.org).' } }), expect: atLeast('librarian', 200), fuzz: { as: 'librarian' },
  },
  {
    // The e-mail's one-click unsubscribe: no session, the signed token is the proof; a bad one is refused.
    route: 'POST /api/unsubscribe', file: 'app/api/unsubscribe/route.ts', method: 'POST', kind: 'api', body: 'json',
    request: () => ({ path: '/api/unsubscribe', json: { token: 'not-a-real-unsubscribe-token' } }), expect: every(400), fuzz: { as: 'anonymous' },
  },

  // Pages
  { route: 'GET /unsubscribe', file: 'app/(auth)/unsubscribe/page.tsx', method: 'GET', kind: 'page', body: 'none', request: () => ({ path: '/unsubscribe' }), expect: every(200) },
  { route: 'GET /answers/[id]', file: 'app/(club)/answers/[id]/page.tsx', method: 'GET', kind: 'page', body: 'none', request: async (f, a) => ({ path: `/answers/${await ownAnswer(f, a)}` }), expect: pageSignedIn },
  { route: 'GET /notes/[slug]', file: 'app/(club)/notes/[slug]/page.tsx', method: 'GET', kind: 'page', body: 'none', request: async (f) => ({ path: `/notes/${await publishedNote(f)}` }), expect: pageSignedIn },
  { route: 'GET /notes/[slug]/edit', file: 'app/(club)/notes/[slug]/edit/page.tsx', method: 'GET', kind: 'page', body: 'none', request: async (f) => ({ path: `/notes/${await publishedNote(f)}/edit` }), expect: pageAtLeast('librarian') },
  { route: 'GET /notes/new', file: 'app/(club)/notes/new/page.tsx', method: 'GET', kind: 'page', body: 'none', request: () => ({ path: '/notes/new' }), expect: pageAtLeast('librarian') },
  { route: 'GET /species/[slug]', file: 'app/(club)/species/[slug]/page.tsx', method: 'GET', kind: 'page', body: 'none', request: async (f) => ({ path: `/species/${await matrixSpecies(f)}` }), expect: every(200) },
  { route: 'GET /species/[slug]/edit', file: 'app/(club)/species/[slug]/edit/page.tsx', method: 'GET', kind: 'page', body: 'none', request: async (f) => ({ path: `/species/${await matrixSpecies(f)}/edit` }), expect: pageAtLeast('editor') },
  { route: 'GET /species/[slug]/history', file: 'app/(club)/species/[slug]/history/page.tsx', method: 'GET', kind: 'page', body: 'none', request: async (f) => ({ path: `/species/${await matrixSpecies(f)}/history` }), expect: pageSignedIn },
  { route: 'GET /species/import', file: 'app/(club)/species/import/page.tsx', method: 'GET', kind: 'page', body: 'none', request: () => ({ path: '/species/import' }), expect: pageAtLeast('editor') },
  { route: 'GET /species/new', file: 'app/(club)/species/new/page.tsx', method: 'GET', kind: 'page', body: 'none', request: () => ({ path: '/species/new' }), expect: pageAtLeast('editor') },
  { route: 'GET /trees/[id]', file: 'app/(club)/trees/[id]/page.tsx', method: 'GET', kind: 'page', body: 'none', request: async (f, a) => ({ path: `/trees/${await ownTree(f, a)}` }), expect: pageSignedIn },
  { route: 'GET /trees/[id]/edit', file: 'app/(club)/trees/[id]/edit/page.tsx', method: 'GET', kind: 'page', body: 'none', request: async (f, a) => ({ path: `/trees/${await ownTree(f, a)}/edit` }), expect: pageSignedIn },
  { route: 'GET /season', file: 'app/(club)/season/page.tsx', method: 'GET', kind: 'page', body: 'none', request: () => ({ path: '/season' }), expect: pageSignedIn },
  { route: 'GET /trees/new', file: 'app/(club)/trees/new/page.tsx', method: 'GET', kind: 'page', body: 'none', request: () => ({ path: '/trees/new' }), expect: pageSignedIn },
];
