import { describe, expect, it } from 'vitest';
import { compareResults } from '@/lib/wizard/compare';
import { evaluate } from '@/lib/wizard/engine';
import { ask, blackPine, north, scots } from '../../support/wizard-fixtures';

describe('re-run comparison', () => {
  it('finds no change for the same inputs, whatever the key order of the stored copy', () => {
    const a = evaluate(ask(), scots, north);
    const reverseKeys = (v: unknown): unknown =>
      Array.isArray(v)
        ? v.map(reverseKeys)
        : v && typeof v === 'object'
          ? Object.fromEntries(
              Object.entries(v)
                .reverse()
                .map(([k, x]) => [k, reverseKeys(x)]),
            )
          : v;
    const reordered = reverseKeys(a) as typeof a;
    reordered.fertilizer = { ...a.fertilizer, pelletsPerPile: { max: 8, min: 6 } };
    reordered.reasons = a.reasons.map((r) => ({ source: r.source, text: r.text, rule: r.rule }));
    const c = compareResults(reordered, a);
    expect(c.same).toBe(true);
    expect(c.why[0]).toMatch(/Nothing changed/);
  });

  it('says what changed and why when the species record changes', () => {
    const before = evaluate(ask({ health: 'strong', date: '2027-06-20', shoot: 'needles-opening' }), scots, north);
    const after = evaluate(ask({ health: 'strong', date: '2027-06-20', shoot: 'needles-opening' }), { ...blackPine, slug: scots.slug, revision: 4 }, north);
    const c = compareResults(before, after);
    expect(c.same).toBe(false);
    expect(c.changes).toContainEqual({ field: 'action', label: 'Action', before: 'wait', after: 'decandle' });
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

  it('re-runs a stored 1.0.0 answer that lacks the v2 fields and says what changed', () => {
    const now = evaluate(ask({ candleStrength: 'strong' }), scots, north);
    const v1 = {
      action: 'pinch',
      stage: 'refinement',
      season: 'spring',
      keepNeedlePairs: 2,
      engineVersion: '1.0.0',
      speciesRevision: now.speciesRevision,
      reasons: [{ rule: 'refine.keep-two-pairs-single-flush', text: 'Leave at least two pairs of needles.', source: 'common practice' }],
      fertilizer: now.fertilizer,
    } as unknown as Parameters<typeof compareResults>[0];
    const c = compareResults(v1, now);
    expect(c.engineChanged).toEqual({ before: '1.0.0', after: '2.0.0' });
    expect(c.changes.map((x) => x.field)).toEqual(expect.arrayContaining(['keepNeedlePairs', 'candleKeep']));
    expect(c.changes.find((x) => x.field === 'candleKeep')).toMatchObject({ before: null, after: { min: 0.33, max: 0.5 } });
    expect(c.why.join(' ')).toMatch(/no longer exists/);
  });
});
