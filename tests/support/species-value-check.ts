import type { SpeciesRecord, SpeciesTraits } from '@/lib/validation/species';

// Checks shipped species records against a table of checked values. Each row names a species, a
// trait, the value its source gives and that source. A published row must match the file's value,
// provenance and citation; a trade row (flush habit) must match the value and must not claim a
// publication. Every published value in a file must have a row, so nothing goes unchecked.

export const TRADE = 'common practice, no published source';

export type ValueRow = [slug: string, trait: keyof SpeciesTraits | 'wildingCaution', value: unknown, citation: string];

export interface ValueProblem {
  slug: string;
  trait: string;
  message: string;
}

const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

export function checkSpeciesValues(records: SpeciesRecord[], table: ValueRow[]): ValueProblem[] {
  const problems: ValueProblem[] = [];
  const bySlug = new Map(records.map((r) => [r.slug, r]));
  const covered = new Set<string>();
  for (const [slug, trait, value, citation] of table) {
    const rec = bySlug.get(slug);
    if (!rec) {
      problems.push({ slug, trait, message: 'the species is not shipped' });
      continue;
    }
    covered.add(`${slug} ${trait}`);
    if (trait === 'wildingCaution') {
      const c = rec.cautions.find((x) => /planted out/.test(x.text));
      if (!c) problems.push({ slug, trait, message: 'the wilding caution is missing' });
      else if (c.provenance !== 'published' || c.citation !== citation) problems.push({ slug, trait, message: `the caution should cite ${citation}` });
      continue;
    }
    const t = rec.traits[trait];
    if (!same(t.value, value)) problems.push({ slug, trait, message: `the file says ${JSON.stringify(t.value)}, its source says ${JSON.stringify(value)}` });
    if (citation === TRADE) {
      if (t.provenance === 'published') problems.push({ slug, trait, message: 'a trade value is marked as published' });
    } else if (t.provenance !== 'published' || t.citation !== citation) {
      problems.push({ slug, trait, message: `the file should cite ${citation}` });
    }
  }
  for (const rec of records) {
    for (const [trait, t] of Object.entries(rec.traits)) {
      if (t.provenance === 'published' && !covered.has(`${rec.slug} ${trait}`))
        problems.push({ slug: rec.slug, trait, message: 'a published value has no row in the table' });
    }
    if (!covered.has(`${rec.slug} flushHabit`)) problems.push({ slug: rec.slug, trait: 'flushHabit', message: 'the flush habit has no row in the table' });
    for (const c of rec.cautions) {
      if (c.provenance === 'published' && /planted out/.test(c.text) && !covered.has(`${rec.slug} wildingCaution`))
        problems.push({ slug: rec.slug, trait: 'wildingCaution', message: 'a published caution has no row in the table' });
    }
  }
  return problems;
}
