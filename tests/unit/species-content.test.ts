import { describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import { parseSpeciesMarkdown, serializeSpeciesMarkdown } from '@/lib/species/content';
import { readSpeciesDir } from '@/lib/species/content-dir';

const dir = path.resolve(__dirname, '../../content/species');
const read = (slug: string) => fs.readFileSync(path.join(dir, `${slug}.md`), 'utf8');
const good = read('pinus-sylvestris');

describe('species content files', () => {
  it('every shipped file passes the schema and is named after its slug', () => {
    const files = readSpeciesDir(dir);
    expect(files.length).toBeGreaterThanOrEqual(24);
    for (const f of files) {
      expect(f.result, f.file).toMatchObject({ ok: true });
      if (f.result.ok) expect(f.file).toBe(`${f.result.record.slug}.md`);
    }
  });

  it('round-trips through serialize and parse', () => {
    const first = parseSpeciesMarkdown(good);
    if (!first.ok) throw new Error('fixture broken');
    const again = parseSpeciesMarkdown(serializeSpeciesMarkdown(first.record, first.body));
    expect(again).toEqual(first);
  });

  it('rejects a file without front matter', () => {
    const r = parseSpeciesMarkdown('# just notes');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(Object.keys(r.fields)).toContain('frontMatter');
  });

  it('rejects broken YAML naming the front matter', () => {
    const r = parseSpeciesMarkdown('---\nslug: [unclosed\n---\nbody');
    expect(r.ok).toBe(false);
    if (!r.ok) expect(r.fields.frontMatter).toBeDefined();
  });

  it('names the field at fault: unknown flush habit', () => {
    const r = parseSpeciesMarkdown(good.replace('value: single', 'value: triple'));
    expect(r.ok).toBe(false);
    if (!r.ok) expect(Object.keys(r.fields)).toContain('traits.flushHabit.value');
  });

  it('names the field at fault: published value without a citation', () => {
    const broken = good.replace(/(needlesPerFascicle:\n\s+value: 2\n\s+provenance: published\n)\s+citation: .*\n/, '$1');
    expect(broken).not.toBe(good);
    const r = parseSpeciesMarkdown(broken);
    expect(r.ok).toBe(false);
    if (!r.ok) expect(Object.keys(r.fields)).toContain('traits.needlesPerFascicle.citation');
  });

  it('names the field at fault: needle range inverted, bad slug, no common name', () => {
    const r1 = parseSpeciesMarkdown(good.replace('{ min: 30, max: 70 }', '{ min: 70, max: 30 }'));
    expect(!r1.ok && Object.keys(r1.fields)).toContain('traits.needleLengthMm.value.max');
    const r2 = parseSpeciesMarkdown(good.replace('slug: pinus-sylvestris', 'slug: Pinus Sylvestris'));
    expect(!r2.ok && Object.keys(r2.fields)).toContain('slug');
    const r3 = parseSpeciesMarkdown(good.replace('commonNames: [Scots pine, Scotch pine]', 'commonNames: []'));
    expect(!r3.ok && Object.keys(r3.fields)).toContain('commonNames');
  });

  it('names a missing provenance', () => {
    const r = parseSpeciesMarkdown(good.replace(/(vigour:\n\s+value: moderate\n)\s+provenance: published\n/, '$1'));
    expect(!r.ok && Object.keys(r.fields)).toContain('traits.vigour.provenance');
  });
});
