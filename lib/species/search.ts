import Fuse, { type IFuseOptions } from 'fuse.js';

// Fuzzy search over species names, shared by the server list API, the /species table (results
// as you type) and the wizard's species picker, so all three rank the same way.

export interface SearchableSpecies {
  slug: string;
  botanicalName: string;
  commonNames: string[];
  synonyms: string[];
}

export const speciesFuseOptions: IFuseOptions<SearchableSpecies> = {
  keys: [
    { name: 'botanicalName', weight: 2 },
    { name: 'commonNames', weight: 2 },
    { name: 'synonyms', weight: 1 },
    // The species epithet alone ("sylvestris", "mugo") is what growers usually type.
    { name: 'epithet', getFn: (s) => s.botanicalName.split(/\s+/).slice(1).join(' '), weight: 2 },
  ],
  includeScore: true,
  ignoreLocation: true,
  threshold: 0.4,
  minMatchCharLength: 2,
};

export function buildSpeciesIndex<T extends SearchableSpecies>(items: T[]): Fuse<T> {
  return new Fuse(items, speciesFuseOptions as IFuseOptions<T>);
}

/** Best match first; ties broken by botanical name so the order is stable (cursor paging relies on it). */
export function searchSpecies<T extends SearchableSpecies>(items: T[], q: string, index = buildSpeciesIndex(items)): { item: T; score: number }[] {
  const query = q.trim();
  if (!query) return items.map((item) => ({ item, score: 0 }));
  return index
    .search(query)
    .map((r) => ({ item: r.item, score: Math.round((r.score ?? 0) * 1e6) / 1e6 }))
    .sort((a, b) => a.score - b.score || a.item.botanicalName.localeCompare(b.item.botanicalName) || a.item.slug.localeCompare(b.item.slug));
}
