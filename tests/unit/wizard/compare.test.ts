import { describe, expect, it } from 'vitest';
import { compareResults } from '@/lib/wizard/compare';
import { evaluate } from '@/lib/wizard/engine';
import { ask, blackPine, north, scots } from '../../support/wizard-fixtures';

describe('re-run comparison', () => {
  it('finds no change for the same inputs, whatever the key order of the stored copy', () => {
    const a = evaluate(ask(), scots, north);
    const reordered = JSON.parse(JSON.stringify(a, Object.keys(a).sort()));
    reordered.fertilizer = { ...a.fertilizer, pelletsPerPile: { max: 8, min: 6 } };
    reordered.reasons = a.reasons.map((r) => ({ source: r.source, text: r.text, rule: r.rule }));
    const c = compareResults(reordered, a);
    expect(c.same).toBe(true);
    expect(c.why[0]).toMatch(/Nothing changed/);
  });

  it('says what changed and why when the species record changes', () => {
    const before = evaluate(ask({ health: 'strong', date: '2027-06-20' }), scots, north);
    const after = evaluate(ask({ health: 'strong', date: '2027-06-20' }), { ...blackPine, slug: scots.slug, revision: 4 }, north);
    const c = compareResults(before, after);
    expect(c.same).toBe(false);
    expect(c.changes).toContainEqual({ field: 'action', label: 'Action', before: 'pinch', after: 'decandle' });
    expect(c.speciesChanged).toEqual({ before: 3, after: 4 });
    expect(c.rulesAdded.map((r) => r.rule)).toContain('flush.double-decandle');
    expect(c.rulesRemoved.map((r) => r.rule)).toContain('flush.single-never-decandle');
    expect(c.why.join(' ')).toMatch(/revision 3 to 4/);
  });

  it('reports an engine version change and rules that no longer exist', () => {
    const a = evaluate(ask(), scots, north);
    const old = { ...a, engineVersion: '0.9.0', reasons: [...a.reasons, { rule: 'old.rule', text: 'gone', source: 'common practice' }] };
    const c = compareResults(old, a);
    expect(c.engineChanged).toEqual({ before: '0.9.0', after: a.engineVersion });
    expect(c.why.join(' ')).toMatch(/“old\.rule” no longer exists/);
  });
});
