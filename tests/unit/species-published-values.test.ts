import { describe, expect, it } from 'vitest';
import path from 'node:path';
import { readSpeciesDir } from '@/lib/species/content-dir';
import type { SpeciesRecord } from '@/lib/validation/species';
import { checkSpeciesValues, TRADE } from '../support/species-value-check';
import { speciesValueTable } from './species-value-table';

// The shipped files, parsed exactly as the seed and the import parse them.
const files = readSpeciesDir(path.resolve(__dirname, '../../content/species'));
const records: SpeciesRecord[] = files.flatMap((f) => (f.result.ok ? [f.result.record] : []));
const copy = () => structuredClone(records);
const edit = (recs: SpeciesRecord[], slug: string, fn: (r: SpeciesRecord) => void) => {
  const r = recs.find((x) => x.slug === slug);
  if (!r) throw new Error(`missing ${slug}`);
  fn(r);
  return recs;
};

describe('every shipped value against the source table', () => {
  it('parses every species file', () => {
    expect(files.filter((f) => !f.result.ok).map((f) => f.file)).toEqual([]);
    expect(records.length).toBeGreaterThanOrEqual(60);
  });

  it('the shipped files agree with every row, and every published value has a row', () => {
    expect(checkSpeciesValues(records, speciesValueTable)).toEqual([]);
  });

  it('the table covers every species (at least its flush habit) and names a source on every row', () => {
    const slugs = new Set(speciesValueTable.map(([slug]) => slug));
    for (const r of records) expect(slugs.has(r.slug), r.slug).toBe(true);
    for (const [slug, trait, , citation] of speciesValueTable) expect(citation.length, `${slug} ${trait}`).toBeGreaterThan(5);
    const published = speciesValueTable.filter((row) => row[3] !== TRADE);
    expect(published.length).toBeGreaterThan(100);
  });

  it('catches a five-needle pine given 2 needles', () => {
    const problems = checkSpeciesValues(
      edit(copy(), 'pinus-parviflora', (r) => (r.traits.needlesPerFascicle.value = 2)),
      speciesValueTable,
    );
    expect(problems).toEqual([expect.objectContaining({ slug: 'pinus-parviflora', trait: 'needlesPerFascicle' })]);
    expect(problems[0].message).toMatch(/file says 2, its source says 5/);
  });

  it('catches a needle length ten times too long', () => {
    const problems = checkSpeciesValues(
      edit(copy(), 'pinus-thunbergii', (r) => (r.traits.needleLengthMm.value = { min: 600, max: 1200 })),
      speciesValueTable,
    );
    expect(problems.map((p) => `${p.slug} ${p.trait}`)).toEqual(['pinus-thunbergii needleLengthMm']);
  });

  it('catches a single-flush species marked double, and a polycyclic one marked single', () => {
    const recs = edit(copy(), 'pinus-sylvestris', (r) => (r.traits.flushHabit.value = 'double'));
    edit(recs, 'pinus-contorta', (r) => (r.traits.flushHabit.value = 'single'));
    const problems = checkSpeciesValues(recs, speciesValueTable);
    expect(problems.map((p) => `${p.slug} ${p.trait}`).sort()).toEqual(['pinus-contorta flushHabit', 'pinus-sylvestris flushHabit']);
  });

  it('catches a value whose citation was swapped, a trade value claimed as published, and a dropped wilding caution', () => {
    const recs = edit(copy(), 'pinus-sylvestris', (r) => (r.traits.needleLengthMm.citation = 'Flora of China vol. 4 (1999)'));
    edit(recs, 'pinus-mugo', (r) => Object.assign(r.traits.flushHabit, { provenance: 'published', citation: 'a made-up book' }));
    edit(recs, 'pinus-contorta', (r) => (r.cautions = r.cautions.filter((c) => !/planted out/.test(c.text))));
    const found = checkSpeciesValues(recs, speciesValueTable)
      .map((p) => `${p.slug} ${p.trait}`)
      .sort();
    expect(found).toEqual(['pinus-contorta wildingCaution', 'pinus-mugo flushHabit', 'pinus-sylvestris needleLengthMm']);
  });

  it('catches a new published value that nobody added to the table', () => {
    const recs = edit(copy(), 'abies-alba', (r) => Object.assign(r.traits.needleLengthMm, { provenance: 'published', citation: 'Flora Europaea vol. 1' }));
    expect(checkSpeciesValues(recs, speciesValueTable)).toEqual([
      { slug: 'abies-alba', trait: 'needleLengthMm', message: 'a published value has no row in the table' },
    ]);
  });

  it('wilding cautions with a source on the species known to spread where planted out', () => {
    const wild = speciesValueTable.filter(([, trait]) => trait === 'wildingCaution').map(([slug]) => slug);
    for (const slug of ['pinus-mugo', 'pinus-contorta', 'larix-decidua', 'pinus-radiata', 'pseudotsuga-menziesii', 'pinus-uncinata'])
      expect(wild, slug).toContain(slug);
    for (const slug of wild) {
      const c = records.find((r) => r.slug === slug)!.cautions.find((x) => /planted out/.test(x.text))!;
      expect(c.text, slug).toMatch(/local rules/);
    }
  });

  it('ambiguous group names sit on every species they name, and only there', () => {
    // "five-needle pine" names every pine with needles in fives.
    const fives = records
      .filter((r) => r.genus === 'Pinus' && r.traits.needlesPerFascicle.value === 5)
      .map((r) => r.slug)
      .sort();
    const named = records
      .filter((r) => [...r.commonNames, ...r.synonyms].some((n) => n.toLowerCase() === 'five-needle pine'))
      .map((r) => r.slug)
      .sort();
    expect(named).toEqual(fives);
    expect(fives.length).toBeGreaterThanOrEqual(10);
    // "foxtail pine" is P. balfouriana, not the bristlecone.
    const foxtail = records.filter((r) => [...r.commonNames, ...r.synonyms].some((n) => /foxtail pine/i.test(n))).map((r) => r.slug);
    expect(foxtail).toEqual(['pinus-balfouriana']);
    // "red pine" names P. resinosa in North America and the Japanese and Chinese red pines.
    const red = records
      .filter((r) => [...r.commonNames, ...r.synonyms].some((n) => n.toLowerCase() === 'red pine'))
      .map((r) => r.slug)
      .sort();
    expect(red).toEqual(['pinus-densiflora', 'pinus-resinosa', 'pinus-tabuliformis']);
  });
});
