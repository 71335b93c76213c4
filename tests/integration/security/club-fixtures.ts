import type { Actor, Fixtures } from './fixtures';
import { evaluateBody, pngBytes, treeBody, uploadPhoto } from './bodies';

// Things each actor owns (a tree, an answer, a photo) and shared objects (a species the matrix
// may edit, a published meeting note), made through the API. The anonymous "own" the member's,
// so their requests name real objects and must still get 401.
type Owner = Exclude<Actor, 'anonymous'>;
const ownerOf = (a: Actor): Owner => (a === 'anonymous' ? 'member' : a);

let letters = 0;
/** A slug-safe unique word (species slugs allow letters and hyphens only). */
export function uniqueLetters() {
  let n = Date.now() * 1000 + letters++;
  let s = '';
  while (n > 0) {
    s = String.fromCharCode(97 + (n % 26)) + s;
    n = Math.floor(n / 26);
  }
  return s;
}

export async function newTree(f: Fixtures, actor: Actor): Promise<string> {
  const c = await f.client(ownerOf(actor));
  const r = await c.json('/api/trees', 'POST', await treeBody(f, `Matrix tree of ${ownerOf(actor)}`));
  if (r.status !== 201) throw new Error(`tree for ${actor}: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body.tree.id;
}
export const ownTree = (f: Fixtures, actor: Actor) => f.once(`tree:${ownerOf(actor)}`, () => newTree(f, actor));

export async function newAnswer(f: Fixtures, actor: Actor): Promise<string> {
  const c = await f.client(ownerOf(actor));
  const r = await c.json('/api/answers', 'POST', await evaluateBody(f));
  if (r.status !== 201) throw new Error(`answer for ${actor}: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body.id;
}
export const ownAnswer = (f: Fixtures, actor: Actor) => f.once(`answer:${ownerOf(actor)}`, () => newAnswer(f, actor));

export async function newPhoto(f: Fixtures, actor: Actor): Promise<string> {
  const c = await f.client(ownerOf(actor));
  // A fresh tree each time: an item holds at most six photos.
  const r = await uploadPhoto(c, { treeId: await newTree(f, actor) }, await pngBytes());
  if (r.status !== 201) throw new Error(`photo for ${actor}: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body.photo.id;
}
export const ownPhoto = (f: Fixtures, actor: Actor) => f.once(`photo:${ownerOf(actor)}`, () => newPhoto(f, actor));

interface SpeciesView {
  slug: string;
  revision: number;
  record: Record<string, unknown>;
  body: string;
}

/** The demo species' record, as a template for new ones. */
async function templateSpecies(f: Fixtures): Promise<SpeciesView> {
  return f.once('species-template', async () => {
    const c = await f.client('editor');
    const list = await c.json('/api/species?limit=1', 'GET');
    const slug = list.body.items[0].slug;
    return (await c.json(`/api/species/${slug}`, 'GET')).body.species as SpeciesView;
  });
}

export async function speciesCreateBody(f: Fixtures) {
  const t = await templateSpecies(f);
  const epithet = uniqueLetters();
  const slug = `pinus-${epithet}`;
  // Names of its own: a copy that kept the template's common names would compete with it in searches.
  return {
    record: { ...t.record, slug, botanicalName: `Pinus ${epithet}`, commonNames: [`Matrix pine ${epithet}`], synonyms: [] },
    body: 'Care notes of a test species.',
    summary: 'security matrix',
    publish: true,
  };
}

/** A published species the matrix may edit, so the demo species stay as they are. */
export const matrixSpecies = (f: Fixtures) =>
  f.once('matrix-species', async () => {
    const r = await (await f.client('admin')).json('/api/species', 'POST', await speciesCreateBody(f));
    if (r.status !== 201) throw new Error(`matrix species: ${r.status} ${JSON.stringify(r.body)}`);
    return r.body.species.slug as string;
  });

/** The species as it is now (its latest revision, for baseRevision). */
export async function currentSpecies(f: Fixtures, slug: string): Promise<SpeciesView> {
  const r = await (await f.client('admin')).json(`/api/species/${slug}`, 'GET');
  return r.body.species as SpeciesView;
}

export async function speciesMarkdown(f: Fixtures, newSlug: string) {
  const slug = await matrixSpecies(f);
  const md = await (await (await f.client('admin')).get(`/api/species/${slug}/export`)).text();
  return md.replace(`slug: ${slug}`, `slug: ${newSlug}`);
}

export async function newNote(f: Fixtures, status: 'draft' | 'published' = 'published'): Promise<string> {
  const r = await (
    await f.client('librarian')
  ).json('/api/notes', 'POST', {
    title: `Matrix meeting ${uniqueLetters()}`,
    meetingDate: '2026-11-14',
    body: 'We looked at candles on the **black pines**.',
    status,
  });
  if (r.status !== 201) throw new Error(`note: ${r.status} ${JSON.stringify(r.body)}`);
  return r.body.note.slug;
}
export const publishedNote = (f: Fixtures) => f.once('published-note', () => newNote(f));
