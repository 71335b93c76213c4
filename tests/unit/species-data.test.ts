import { beforeAll, describe, expect, it } from 'vitest';
import { memoryDb } from '../support/memory-db';
import { eq } from 'drizzle-orm';
import { species } from '@/db/schema';
import type { SessionUser } from '@/lib/auth/session';
import { getSpeciesForViewer, getWizardSpecies, listSpeciesRevisions } from '@/lib/data/species';
import { listSpecies } from '@/lib/data/species-list';
import { createSpecies, commitSpeciesImport, previewSpeciesImport, revertSpecies, updateSpecies } from '@/lib/data/species-editorial';
import { serializeSpeciesMarkdown } from '@/lib/species/content';
import { speciesListQuerySchema, type SpeciesRecord } from '@/lib/validation/species';

const mem = memoryDb();
let editor: SessionUser;
let member: SessionUser;
const q = (o: Record<string, unknown> = {}) => speciesListQuerySchema.parse(o);

beforeAll(async () => {
  editor = await mem.user('editor@candlewise.test');
  member = await mem.user('member@candlewise.test');
});

describe('species list', () => {
  it('pages through every published species with a keyset cursor, no repeats', async () => {
    const seen: string[] = [];
    let cursor: string | undefined;
    do {
      const page = await listSpecies(member, q({ limit: 7, cursor }));
      seen.push(...page.items.map((i) => i.slug));
      cursor = page.nextCursor ?? undefined;
    } while (cursor);
    expect(seen.length).toBeGreaterThanOrEqual(24);
    expect(new Set(seen).size).toBe(seen.length);
  });

  it('filters by group, flush habit, vigour and needle length', async () => {
    const larches = await listSpecies(null, q({ group: 'larch' }));
    expect(larches.items.map((i) => i.slug).sort()).toEqual(['larix-decidua', 'larix-kaempferi', 'larix-laricina']);
    const doubles = await listSpecies(null, q({ flush: 'double' }));
    expect(doubles.items.map((i) => i.slug).sort()).toEqual(['pinus-densiflora', 'pinus-thunbergii']);
    const long = await listSpecies(null, q({ needleMin: 150 }));
    for (const i of long.items) expect(i.needleLengthMm.max!).toBeGreaterThanOrEqual(150);
    expect(long.items.map((i) => i.slug)).toContain('pinus-pinea');
    const low = await listSpecies(null, q({ vigour: 'low', group: 'pine' }));
    expect(low.items.map((i) => i.slug)).toContain('pinus-parviflora');
  });

  it('ranks by search score and pages search results too', async () => {
    const first = await listSpecies(null, q({ q: 'pine', limit: 5 }));
    expect(first.items).toHaveLength(5);
    expect(first.nextCursor).toBeTruthy();
    const second = await listSpecies(null, q({ q: 'pine', limit: 5, cursor: first.nextCursor }));
    expect(second.items[0].score!).toBeGreaterThanOrEqual(first.items[4].score!);
    expect(second.items.map((i) => i.slug)).not.toContain(first.items[4].slug);
    expect((await listSpecies(null, q({ q: 'sylvestrus' }))).items[0].slug).toBe('pinus-sylvestris');
  });

  it('refuses a forged cursor', async () => {
    await expect(listSpecies(null, q({ cursor: 'not-a-cursor' }))).rejects.toMatchObject({ status: 400 });
  });
});

describe('editorial workflow', () => {
  it('keeps drafts away from members and the wizard, then publishes', async () => {
    const pub = await getSpeciesForViewer(editor, 'pinus-mugo');
    const record: SpeciesRecord = structuredClone(pub.record);
    record.commonNames = [...record.commonNames, 'Draft-only name'];
    const draft = await updateSpecies(editor, 'pinus-mugo', {
      record,
      body: pub.body,
      summary: 'add a name',
      publish: false,
      baseRevision: pub.latestRevision,
    });
    expect(draft).toMatchObject({ revision: 2, status: 'draft', publishedRevision: 1 });

    expect((await getSpeciesForViewer(member, 'pinus-mugo')).record.commonNames).not.toContain('Draft-only name');
    await expect(getSpeciesForViewer(member, 'pinus-mugo', 2)).rejects.toMatchObject({ status: 404 });
    expect((await getSpeciesForViewer(editor, 'pinus-mugo', 2)).record.commonNames).toContain('Draft-only name');
    expect((await listSpeciesRevisions(member, 'pinus-mugo')).map((r) => r.revision)).toEqual([1]);
    expect((await listSpeciesRevisions(editor, 'pinus-mugo')).map((r) => r.revision)).toEqual([2, 1]);
    expect((await getWizardSpecies('pinus-mugo'))?.revision).toBe(1);

    // A stale base revision is refused.
    await expect(updateSpecies(editor, 'pinus-mugo', { record, body: '', summary: '', publish: true, baseRevision: 1 })).rejects.toMatchObject({ status: 409 });

    record.traits.vigour = { value: 'high', provenance: 'from-memory' };
    const published = await updateSpecies(editor, 'pinus-mugo', { record, body: pub.body, summary: 'publish', publish: true, baseRevision: 2 });
    expect(published).toMatchObject({ revision: 3, publishedRevision: 3 });
    const [row] = await mem.db.select({ vigour: species.vigour }).from(species).where(eq(species.slug, 'pinus-mugo'));
    expect(row.vigour).toBe('high');
    expect((await getWizardSpecies('pinus-mugo'))?.revision).toBe(3);

    const reverted = await revertSpecies(editor, 'pinus-mugo', { toRevision: 1, baseRevision: 3, summary: '', publish: true });
    expect(reverted.revision).toBe(4);
    const [after] = await mem.db.select({ vigour: species.vigour }).from(species).where(eq(species.slug, 'pinus-mugo'));
    expect(after.vigour).toBe('moderate');
    expect((await listSpeciesRevisions(editor, 'pinus-mugo'))[0]).toMatchObject({ revision: 4, summary: 'Reverted to revision 1', current: true });
  });

  it('refuses members, hides draft-only species from them, and keeps slugs unique', async () => {
    const base = (await getSpeciesForViewer(editor, 'pinus-sylvestris')).record;
    const record = { ...structuredClone(base), slug: 'pinus-inventa', botanicalName: 'Pinus inventa' };
    await expect(createSpecies(member, { record, body: '', summary: '', publish: false })).rejects.toMatchObject({ status: 403 });
    await createSpecies(editor, { record, body: 'notes', summary: 'new', publish: false });
    await expect(getSpeciesForViewer(member, 'pinus-inventa')).rejects.toMatchObject({ status: 404 });
    expect((await listSpecies(member, q({ q: 'inventa' }))).items.map((i) => i.slug)).not.toContain('pinus-inventa');
    expect((await listSpecies(editor, q({ q: 'inventa' }))).items[0]).toMatchObject({ slug: 'pinus-inventa', publishedRevision: null, hasDraft: true });
    await expect(createSpecies(editor, { record, body: '', summary: '', publish: false })).rejects.toMatchObject({ status: 409 });
    await expect(
      updateSpecies(editor, 'pinus-inventa', { record: { ...record, slug: 'pinus-other' }, body: '', summary: '', publish: false, baseRevision: 1 }),
    ).rejects.toMatchObject({ status: 422 });
  });

  it('previews an import without writing, then commits all or nothing', async () => {
    const base = (await getSpeciesForViewer(editor, 'pinus-sylvestris')).record;
    const fresh = serializeSpeciesMarkdown({ ...structuredClone(base), slug: 'pinus-importata', botanicalName: 'Pinus importata' }, 'Notes.');
    const broken = fresh.replace('slug: pinus-importata', 'slug: 12').replace('Pinus importata', 'Pinus fracta');
    const preview = await previewSpeciesImport(editor, [
      { name: 'a.md', content: fresh },
      { name: 'b.md', content: broken },
    ]);
    expect(preview[0]).toMatchObject({ ok: true, action: 'create', slug: 'pinus-importata' });
    expect(preview[1].ok).toBe(false);
    expect(Object.keys(preview[1].fields!)).toContain('slug');
    await expect(getSpeciesForViewer(editor, 'pinus-importata')).rejects.toMatchObject({ status: 404 });
    await expect(
      commitSpeciesImport(editor, {
        files: [
          { name: 'a.md', content: fresh },
          { name: 'b.md', content: broken },
        ],
        summary: '',
        publish: true,
      }),
    ).rejects.toMatchObject({ status: 422 });
    await expect(getSpeciesForViewer(editor, 'pinus-importata')).rejects.toMatchObject({ status: 404 });
    await commitSpeciesImport(editor, { files: [{ name: 'a.md', content: fresh }], summary: '', publish: true });
    expect((await getSpeciesForViewer(member, 'pinus-importata')).revision).toBe(1);
    const again = await previewSpeciesImport(editor, [{ name: 'a.md', content: fresh }]);
    expect(again[0].action).toBe('unchanged');
  });
});
