import { describe, expect, it } from 'vitest';
import { treeInputSchema, emptyTree, type TreeInput } from '@/lib/validation/trees';
import { containerSchema, evaluateBodySchema } from '@/lib/validation/wizard';
import { POT_MAX_CM, POT_MIN_CM } from '@/lib/validation/container';
import { askParamsFor } from '@/lib/trees/describe';
import { prefillFromQuery, treeOption } from '@/lib/trees/ask-prefill';
import { answersForTree, toEvaluateBody } from '@/lib/wizard/ask-steps';

const known = new Set(['pinus-sylvestris']);
const today = '2027-05-10';
const tree = (over: Partial<TreeInput>): TreeInput => treeInputSchema.parse({ ...emptyTree, name: 'Big one', speciesSlug: 'pinus-sylvestris', ...over });

/** What "Ask about this tree" sends the wizard, through the tree page's link and /ask's prefill. */
function askedFrom(t: TreeInput) {
  const query = Object.fromEntries(askParamsFor({ id: 'tree-x', ...t }, today));
  const option = treeOption({ id: 'tree-x', speciesName: 'Scots pine', ...t }, known, today);
  return answersForTree(prefillFromQuery(query, known), option);
}

describe('one set of limits for a tree and the wizard', () => {
  it('every pot a tree accepts, the wizard accepts, and the reverse', () => {
    for (const [shape, lengthCm, widthCm] of [
      ['round', 350, null],
      ['rectangle', POT_MAX_CM, POT_MAX_CM],
      ['oval', POT_MIN_CM, POT_MIN_CM],
      ['rectangle', 12.5, 8],
    ] as const) {
      const t = tree({ containerShape: shape, containerLengthCm: lengthCm, containerWidthCm: widthCm });
      const answers = askedFrom(t);
      expect(answers.container).toEqual({ shape, lengthCm, ...(widthCm !== null ? { widthCm } : {}) });
      const body = toEvaluateBody({ ...answers, date: today, health: 'average', shoot: 'candle-extending', branching: 'secondary' });
      expect(evaluateBodySchema.safeParse(body).success).toBe(true);
    }
    for (const bad of [POT_MAX_CM + 1, 0, 0.05]) {
      expect(
        treeInputSchema.safeParse({ ...emptyTree, name: 'x', speciesSlug: 'pinus-sylvestris', containerShape: 'round', containerLengthCm: bad }).success,
      ).toBe(false);
      expect(containerSchema.safeParse({ shape: 'round', lengthCm: bad }).success).toBe(false);
    }
  });

  it('fills in a recently collected tree as recovering, so the wizard skips its shape questions', () => {
    const answers = askedFrom(tree({ collectedFromWild: true, collectedOn: '2026-09-01' }));
    expect(answers).toMatchObject({ tree: 'tree-x', species: 'pinus-sylvestris', recentlyCollected: true });
    expect(evaluateBodySchema.safeParse(toEvaluateBody({ ...answers, date: today, health: 'average', shoot: 'dormant-bud' })).success).toBe(true);
  });

  it('ignores a pot in a link that the wizard would refuse', () => {
    expect(prefillFromQuery({ shape: 'round', lengthCm: '401' }, known).container).toBeUndefined();
    expect(prefillFromQuery({ shape: 'square', lengthCm: '30' }, known).container).toBeUndefined();
    expect(prefillFromQuery({ shape: 'oval', lengthCm: '30', widthCm: '' }, known).container).toBeUndefined();
    expect(prefillFromQuery({ shape: 'round', lengthCm: '350', species: 'pinus-sylvestris' }, known)).toEqual({
      species: 'pinus-sylvestris',
      container: { shape: 'round', lengthCm: 350 },
    });
  });
});
