import { describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import { parseSpeciesMarkdown } from '@/lib/species/content';

// An editor's upload with mistakes: every problem is named in words, in full, never as zod's or yaml's developer text.
const source = fs.readFileSync(path.resolve(__dirname, '../../content/species/pinus-mugo.md'), 'utf8');
const fields = (text: string) => {
  const r = parseSpeciesMarkdown(text);
  if (r.ok) throw new Error('expected errors');
  return r.fields;
};
const developerText = /Invalid option|Invalid input|expected one of|"\|"|Too small|Too big/;

describe('species file messages', () => {
  it('lists every bad field with what was found and the choices, without an enum dump', () => {
    const f = fields(
      source
        .replace('group: pine', 'group: palm')
        .replace(/flushHabit:\n {4}value: \w+/, 'flushHabit:\n    value: triple')
        .replace(/\ngenus: .*/, '')
        .replace(/needlesPerFascicle:\n {4}value: \d+/, 'needlesPerFascicle:\n    value: 2.5'),
    );
    expect(Object.keys(f).sort()).toEqual(['genus', 'group', 'traits.flushHabit.value', 'traits.needlesPerFascicle.value']);
    expect(f.group).toEqual([
      'Group: “palm” is not one of the choices. Use pine, larch, spruce, fir, douglas-fir, hemlock, cedar, juniper, cypress, redwood, yew, podocarp or other.',
    ]);
    expect(f['traits.flushHabit.value'][0]).toBe('Flush habit (trade), value: “triple” is not one of the choices. Use single, double or polycyclic.');
    expect(f.genus[0]).toBe('Genus is missing: add it as text.');
    expect(f['traits.needlesPerFascicle.value'][0]).toMatch(/^Needles per bundle, value: expected a whole number, found 2\.5\.$/);
    for (const msgs of Object.values(f)) for (const m of msgs) expect(m).not.toMatch(developerText);
  });

  it('keeps the schema’s own sentences and names the field', () => {
    const f = fields(source.replace('slug: pinus-mugo', 'slug: Pinus Mugo').replace(/commonNames: \[.*\]/, 'commonNames: []'));
    expect(f.slug[0]).toBe('Slug: Use the botanical name in kebab case, e.g. pinus-sylvestris.');
    expect(f.commonNames[0]).toBe('Common names: Give at least one common name.');
  });

  it('reports every YAML error with its line in the file, the whole reason and the line itself', () => {
    const broken = source.replace('group: pine', 'group: pine: tree').replace(/synonyms: \[(.*)\]/, 'synonyms: [$1');
    const lines = broken.split('\n');
    const f = fields(broken);
    expect(f.frontMatter.length).toBeGreaterThanOrEqual(2);
    const groupLine = lines.findIndex((l) => l.startsWith('group: pine: tree')) + 1;
    expect(
      f.frontMatter.some(
        (m) =>
          m.startsWith(`Line ${groupLine}, column 8: Nested mappings are not allowed in compact mappings.`) && m.endsWith('The line reads: group: pine: tree'),
      ),
    ).toBe(true);
    for (const m of f.frontMatter) {
      expect(m).toMatch(/^Line \d+, column \d+: .+\./);
      expect(m).not.toMatch(/\^|\n/); // no caret drawing, no cut-off block
    }
  });
});
