import { describe, expect, it } from 'vitest';
import path from 'node:path';
import { readSpeciesDir } from '@/lib/species/content-dir';
import { searchSpecies } from '@/lib/species/search';

const items = readSpeciesDir(path.resolve(__dirname, '../../content/species')).flatMap((f) => (f.result.ok ? [f.result.record] : []));
const top = (q: string) => searchSpecies(items, q)[0]?.item.slug;

describe('species fuzzy search over the shipped files', () => {
  it.each([
    ['sylvestrus', 'pinus-sylvestris'], // misspelt epithet
    ['scotch', 'pinus-sylvestris'], // older trade spelling
    ['mugho', 'pinus-mugo'], // trade spelling
    ['dwarf mountain pine', 'pinus-mugo'],
    ['japanese black', 'pinus-thunbergii'],
    ['thunbergi', 'pinus-thunbergii'],
    ['lodgepol', 'pinus-contorta'],
    ['norway spruce', 'picea-abies'],
    ['chinese juniper', 'juniperus-chinensis'],
  ])('%s finds %s first', (q, slug) => {
    expect(top(q)).toBe(slug);
  });

  it('finds nothing for nonsense', () => {
    expect(searchSpecies(items, 'qqqxzv')).toHaveLength(0);
  });

  it('orders results by score, best first', () => {
    const r = searchSpecies(items, 'pine');
    for (let i = 1; i < r.length; i++) expect(r[i].score).toBeGreaterThanOrEqual(r[i - 1].score);
  });
});
