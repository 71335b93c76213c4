import { describe, expect, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import { parseSpeciesMarkdown } from '@/lib/species/content';
import { bodyDiff, recordChanges, revisionDiff, sameContent } from '@/lib/species/revision-diff';
import type { SpeciesRecord } from '@/lib/validation/species';

const dir = path.resolve(__dirname, '../../content/species');
function load(slug: string) {
  const r = parseSpeciesMarkdown(fs.readFileSync(path.join(dir, `${slug}.md`), 'utf8'));
  if (!r.ok) throw new Error(`${slug} does not parse`);
  return { record: r.record, body: r.body };
}

describe('revision diff in words', () => {
  it('names a trait change with its value and its source, using the form labels', () => {
    const a = load('pinus-banksiana');
    const b = structuredClone(a);
    b.record.traits.vigour = { value: 'high', provenance: 'published', citation: 'Flora of North America vol. 2 (1993)' };
    const changes = recordChanges(a.record, b.record);
    expect(changes).toEqual([{ field: 'Vigour', text: 'Vigour: Moderate → High; source: from memory → Flora of North America vol. 2 (1993)' }]);
  });

  it('a source-only change still names the value; a missing citation reads as such', () => {
    const a = load('pinus-banksiana');
    const b = structuredClone(a);
    delete b.record.traits.needleLengthMm.citation;
    expect(recordChanges(a.record, b.record).map((c) => c.text)).toEqual([
      'Natural needle length: 20–50 mm; source: Flora of North America vol. 2 (1993): 2–5 cm → published, citation to come',
    ]);
  });

  it('lists identity fields and cautions that changed, nothing else', () => {
    const a = load('pinus-sylvestris');
    const b = structuredClone(a);
    b.record.commonNames = [...a.record.commonNames, 'Baltic pine'];
    b.record.cautions = [...a.record.cautions, { text: 'Wear gloves when handling resin.', provenance: 'common-practice' }];
    const texts = recordChanges(a.record, b.record).map((c) => c.text);
    expect(texts).toEqual([
      `Common names: ${a.record.commonNames.join(', ')} → ${[...a.record.commonNames, 'Baltic pine'].join(', ')}`,
      'Caution added: “Wear gloves when handling resin.” (common practice)',
    ]);
  });

  it('marks words, keeping a list bullet as text: an edited list item is one changed word', () => {
    const before = '## Pinching\n\n- pinch in spring\n- thin in autumn\n';
    const after = '## Pinching\n\n- pinch in late spring\n- thin in autumn\n';
    const parts = bodyDiff(before, after);
    expect(parts.filter((p) => p.kind === 'removed')).toEqual([]);
    expect(parts.filter((p) => p.kind === 'added').map((p) => p.value.trim())).toEqual(['late']);
    // Put back together, each side is exactly its text: bullets included, none lost or doubled.
    expect(
      parts
        .filter((p) => p.kind !== 'added')
        .map((p) => p.value)
        .join(''),
    ).toBe(before);
    expect(
      parts
        .filter((p) => p.kind !== 'removed')
        .map((p) => p.value)
        .join(''),
    ).toBe(after);
  });

  it('an unchanged pair has no differences; identical content is recognised', () => {
    const a = load('pinus-thunbergii');
    const b = structuredClone(a);
    expect(revisionDiff(a, b)).toMatchObject({ same: true, changes: [], bodyChanged: false });
    expect(sameContent(a, b)).toBe(true);
    (b.record as SpeciesRecord).traits.backBudding.note = 'Checked at the spring meeting.';
    expect(sameContent(a, b)).toBe(false);
    expect(revisionDiff(a, b).same).toBe(false);
  });
});
