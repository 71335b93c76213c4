import { describe, expect, it } from 'vitest';
import path from 'node:path';
import { readSpeciesDir } from '@/lib/species/content-dir';
import { buildSpeciesIndex, compareHits, editDistance, matchNote, searchSpecies } from '@/lib/species/search';

// Ranking against the shipped species files: every query a grower types that the search must forgive.
const items = readSpeciesDir(path.resolve(__dirname, '../../content/species')).flatMap((f) => (f.result.ok ? [f.result.record] : []));
const index = buildSpeciesIndex(items);
const hits = (q: string) => searchSpecies(items, q, index);
const top = (q: string) => hits(q)[0]?.item.slug;
const slugsNaming = (name: string) =>
  items
    .filter((s) => [...s.commonNames, ...s.synonyms].some((n) => n.toLowerCase() === name))
    .map((s) => s.slug)
    .sort();

describe('species search over the shipped files', () => {
  it('reads every shipped species', () => {
    expect(items.length).toBeGreaterThanOrEqual(60);
  });

  it.each([
    // word order and partial words
    ['black pine japanese', 'pinus-thunbergii'],
    ['pine white japanese', 'pinus-parviflora'],
    ['japanese black', 'pinus-thunbergii'],
    ['jap bla', 'pinus-thunbergii'],
    ['red japanese', 'pinus-densiflora'],
    ['lodgepol', 'pinus-contorta'],
    ['thunbergi', 'pinus-thunbergii'],
    // botanical names with a letter missing
    ['pinus sylvestis', 'pinus-sylvestris'],
    ['pnus mugo', 'pinus-mugo'],
    ['picea jezonsis', 'picea-jezoensis'],
    ['cedrus deodra', 'cedrus-deodara'],
    ['juniperus chinesis', 'juniperus-chinensis'],
    ['tsuga heterophyla', 'tsuga-heterophylla'],
    // misspellings and other spellings
    ['sylvestrus', 'pinus-sylvestris'],
    ['mugho', 'pinus-mugo'],
    ['scotch', 'pinus-sylvestris'],
    ['lodgpol', 'pinus-contorta'],
    // plain names
    ['dwarf mountain pine', 'pinus-mugo'],
    ['norway spruce', 'picea-abies'],
    ['chinese juniper', 'juniperus-chinensis'],
    ['douglas fir', 'pseudotsuga-menziesii'],
  ])('%s finds %s first', (q, slug) => {
    expect(top(q)).toBe(slug);
  });

  it('lists every fir first for the genus alone, before Picea abies', () => {
    const firs = items
      .filter((s) => s.genus === 'Abies')
      .map((s) => s.slug)
      .sort();
    expect(firs.length).toBeGreaterThanOrEqual(3);
    const r = hits('abies').map((h) => h.item.slug);
    expect(r.slice(0, firs.length).sort()).toEqual(firs);
    expect(r).toContain('picea-abies');
    expect(r.indexOf('picea-abies')).toBe(firs.length);
  });

  it.each(['red pine', 'white pine', 'black pine', 'stone pine', 'mountain pine'])('ranks every species named %s before any other', (name) => {
    const named = slugsNaming(name);
    expect(named.length).toBeGreaterThanOrEqual(2); // an ambiguous name in the shipped files
    const r = hits(name).map((h) => h.item.slug);
    expect(r.slice(0, named.length).sort()).toEqual(named);
  });

  it('ranks the species whose name is exactly "red pine" before those where it is only a synonym', () => {
    const r = hits('red pine');
    expect(r[0].item.slug).toBe('pinus-resinosa');
    expect(r[0].match).toMatchObject({ text: 'Red pine', kind: 'common' });
  });

  it('says when the query matched another name or a misspelling', () => {
    expect(matchNote(hits('scotch')[0].match)).toBe('matched Scotch pine (common name)');
    expect(matchNote(hits('mugho')[0].match)).toBe('matched mugho (other name)');
    const misspelt = hits('sylvestrus')[0];
    expect(misspelt.match.misspelt).toBe(true);
    expect(matchNote(misspelt.match)).toMatch(/^matched (Pinus )?sylvestris \(.*spelt differently\)$/);
    // The name shown anyway needs no note.
    expect(matchNote(hits('pinus sylvestris')[0].match)).toBeNull();
    expect(matchNote(hits('scots pine')[0].match)).toBeNull();
  });

  it('finds nothing for nonsense', () => {
    expect(hits('qqqxzv')).toHaveLength(0);
  });

  it('orders by score, then botanical name and slug, and lists everything in name order for an empty query', () => {
    const r = hits('pine');
    for (let i = 1; i < r.length; i++) expect(compareHits(r[i - 1], r[i])).toBeLessThan(0);
    const all = hits('  ');
    expect(all).toHaveLength(items.length);
    expect(all.map((h) => h.item.botanicalName)).toEqual(items.map((s) => s.botanicalName).sort());
  });

  it('gives a species the same score whatever else is in the list (paging and the browser rely on it)', () => {
    for (const q of ['white pine', 'sylvestrus', 'abies', 'jap bla']) {
      const whole = new Map(hits(q).map((h) => [h.item.slug, h.score]));
      const half = items.filter((_, i) => i % 2 === 1);
      for (const h of searchSpecies(half, q)) expect(h.score).toBe(whole.get(h.item.slug));
    }
  });

  it('does not forgive misspellings in short words, so three letters stay precise', () => {
    expect(hits('jbp').map((h) => h.item.slug)).toEqual(['pinus-thunbergii']);
    expect(hits('yev')).toHaveLength(0);
  });

  it('counts a swap of neighbouring letters as one edit', () => {
    expect(editDistance('sylvestirs', 'sylvestris', 2)).toBe(1);
    expect(editDistance('mugo', 'mugho', 2)).toBe(1);
    expect(editDistance('abcdef', 'uvwxyz', 2)).toBe(3);
  });
});
