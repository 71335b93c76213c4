import { describe, expect, it } from 'vitest';
import { createActor, fromPromise, waitFor } from 'xstate';
import {
  askMachine,
  canReach,
  disabledReason,
  firstOpenStep,
  questionList,
  toEvaluateBody,
  type AskAnswers,
  type AskInput,
  type SaveRequest,
  type TreeOption,
} from '@/lib/wizard/ask.machine';
import { evaluate } from '@/lib/wizard/engine';
import { evaluateBodySchema, type EvaluateBody } from '@/lib/validation/wizard';
import { shipped } from '../../support/shipped-species';
import { north } from '../../support/wizard-fixtures';

const species = (slug: string) => shipped(slug);

function start(input: AskInput = {}) {
  const calls: { evaluate: EvaluateBody[]; save: SaveRequest[] } = { evaluate: [], save: [] };
  const machine = askMachine.provide({
    actors: {
      evaluate: fromPromise(async ({ input }: { input: EvaluateBody }) => {
        calls.evaluate.push(input);
        if (input.species === 'pinus-unknown') throw new Error('We have no published species with that name.');
        return evaluate(evaluateBodySchema.parse(input), species(input.species), north);
      }),
      save: fromPromise(async ({ input }: { input: SaveRequest }) => {
        calls.save.push(input);
        return { id: 'abcdefghijkl', url: '/answers/abcdefghijkl' };
      }),
    },
  });
  const actor = createActor(machine, { input });
  actor.start();
  return { actor, calls, step: () => actor.getSnapshot().context.step };
}

const full: AskAnswers = {
  species: 'pinus-sylvestris',
  branching: 'tertiary',
  shoot: 'candle-extending',
  position: 'beyond-silhouette',
  health: 'average',
  date: '2027-05-10',
};

const wrenTrees: TreeOption[] = [
  {
    id: 'tree-a',
    name: 'Leaning pine',
    speciesSlug: 'pinus-sylvestris',
    speciesName: 'Scots pine',
    container: { shape: 'oval', lengthCm: 40, widthCm: 30 },
    recentlyCollected: false,
  },
  { id: 'tree-b', name: 'Hill collected', speciesSlug: 'pinus-mugo', speciesName: 'Mountain pine', recentlyCollected: true },
  { id: 'tree-c', name: 'Unknown one', speciesName: 'Pinus imaginaria', recentlyCollected: false },
];

describe('ask machine: the order of the questions', () => {
  it('asks health before the shape questions and evaluates at the end', async () => {
    const { actor, calls, step } = start({ answers: { date: '2027-05-10' } });
    expect(step()).toBe('species');
    actor.send({ type: 'NEXT' }); // not answered: stays
    expect(step()).toBe('species');
    actor.send({ type: 'SET', answers: { species: 'pinus-sylvestris' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('health');
    actor.send({ type: 'SET', answers: { health: 'average' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('shoot');
    actor.send({ type: 'SET', answers: { shoot: 'candle-extending' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('branching');
    actor.send({ type: 'SET', answers: { branching: 'tertiary' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('position');
    actor.send({ type: 'SET', answers: { position: 'beyond-silhouette' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('when');
    actor.send({ type: 'NEXT' });
    const s = await waitFor(actor, (x) => x.matches('answer'));
    expect(s.context.result?.action).toBe('pinch');
    expect(calls.evaluate).toEqual([{ ...full }]);
  });

  it('skips the silhouette question for a development branch and leaves the position out', async () => {
    const { actor, calls, step } = start({
      answers: { species: 'pinus-sylvestris', health: 'strong', shoot: 'needles-hardened', date: '2027-08-20', position: 'interior' },
      step: 'branching',
    });
    expect(step()).toBe('branching');
    actor.send({ type: 'SET', answers: { branching: 'secondary', backBuds: true } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('when');
    actor.send({ type: 'BACK' });
    expect(step()).toBe('branching');
    actor.send({ type: 'NEXT' });
    actor.send({ type: 'NEXT' });
    await waitFor(actor, (x) => x.matches('answer'));
    expect(calls.evaluate[0].position).toBeUndefined();
    expect(calls.evaluate[0].backBuds).toBe(true);
    expect(actor.getSnapshot().context.result?.action).toBe('prune');
  });

  it('passes "repotted this year" and the candle strength to the engine, so a repotted black pine is not decandled', async () => {
    const { actor, calls } = start({
      answers: { species: 'pinus-thunbergii', health: 'strong', repottedThisYear: true, shoot: 'needles-opening', date: '2027-06-20' },
      step: 'branching',
    });
    actor.send({ type: 'SET', answers: { branching: 'tertiary', candleStrength: 'strong' } });
    actor.send({ type: 'NEXT' });
    actor.send({ type: 'SET', answers: { position: 'beyond-silhouette' } });
    actor.send({ type: 'NEXT' });
    actor.send({ type: 'NEXT' });
    await waitFor(actor, (x) => x.matches('answer'));
    expect(calls.evaluate[0]).toMatchObject({ repottedThisYear: true, candleStrength: 'strong' });
    // common practice, no published source: no repotting and candle cutting in one year
    expect(actor.getSnapshot().context.result?.action).not.toBe('decandle');
  });

  it('keeps earlier answers going back and forward', async () => {
    const { actor, step } = start({ answers: { ...full } });
    await waitFor(actor, (x) => x.matches('asking'));
    expect(step()).toBe('when');
    actor.send({ type: 'BACK' });
    actor.send({ type: 'BACK' });
    actor.send({ type: 'BACK' });
    expect(step()).toBe('shoot');
    expect(actor.getSnapshot().context.answers).toEqual(full);
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('branching');
    expect(actor.getSnapshot().context.answers.branching).toBe('tertiary');
  });

  it('opens the step from the URL only when it can be reached', () => {
    expect(start({ answers: { species: 'pinus-sylvestris' }, step: 'shoot' }).step()).toBe('health');
    expect(start({ answers: { ...full }, step: 'position' }).step()).toBe('position');
    expect(start({ answers: { ...full, branching: 'primary' }, step: 'position' }).step()).toBe('when');
    const { actor, step } = start({ answers: { species: 'pinus-sylvestris', health: 'average' } });
    expect(step()).toBe('shoot');
    actor.send({ type: 'GOTO', step: 'when' });
    expect(step()).toBe('shoot');
    actor.send({ type: 'GOTO', step: 'species' });
    expect(step()).toBe('species');
  });

  it('starts at the answer from the URL when everything is answered, and returns with an error when evaluation fails', async () => {
    const ok = start({ answers: { ...full }, step: 'answer' });
    expect((await waitFor(ok.actor, (x) => x.matches('answer'))).context.result?.stage).toBe('refinement');
    const bad = start({ answers: { ...full, species: 'pinus-unknown' }, step: 'answer' });
    const s = await waitFor(bad.actor, (x) => x.matches('asking'));
    expect(s.context.step).toBe('when');
    expect(s.context.error).toMatch(/no published species/);
  });
});

describe('ask machine: a recovering tree', () => {
  it('skips branching and the outline for a weak tree and leaves them out of the body', async () => {
    const { actor, calls, step } = start({
      answers: { species: 'pinus-sylvestris', date: '2027-05-10', branching: 'tertiary', position: 'beyond-silhouette', candleStrength: 'strong' },
      step: 'health',
    });
    actor.send({ type: 'SET', answers: { health: 'weak' } });
    expect(questionList(actor.getSnapshot().context.answers)).toEqual(['species', 'health', 'shoot', 'when']);
    actor.send({ type: 'NEXT' });
    actor.send({ type: 'SET', answers: { shoot: 'candle-extending' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('when');
    actor.send({ type: 'BACK' });
    expect(step()).toBe('shoot');
    actor.send({ type: 'NEXT' });
    actor.send({ type: 'NEXT' });
    const s = await waitFor(actor, (x) => x.matches('answer'));
    expect(calls.evaluate[0]).toEqual({ species: 'pinus-sylvestris', date: '2027-05-10', shoot: 'candle-extending', health: 'weak' });
    expect(s.context.result?.stage).toBe('recovery');
    expect(s.context.result?.action).toBe('let-grow');
  });

  it('skips them for a recently collected tree too', () => {
    expect(questionList({ species: 'pinus-mugo', recentlyCollected: true, health: 'strong' })).toEqual(['species', 'health', 'shoot', 'when']);
    expect(canReach('when', { species: 'pinus-mugo', recentlyCollected: true, health: 'strong', shoot: 'dormant-bud', date: '2027-05-10' })).toBe(true);
  });

  it('gives a recovering tree the same answer whatever the skipped questions would have said', () => {
    // Every shipped pine and a few other groups, every shoot state, every skipped answer.
    for (const slug of ['pinus-sylvestris', 'pinus-thunbergii', 'pinus-mugo', 'juniperus-chinensis', 'larix-decidua', 'picea-abies']) {
      for (const shoot of ['dormant-bud', 'candle-extending', 'needles-opening', 'needles-hardened'] as const) {
        for (const recovering of [{ health: 'weak' as const }, { health: 'strong' as const, recentlyCollected: true }]) {
          const base: AskAnswers = { species: slug, date: '2027-05-10', shoot, ...recovering };
          const reference = evaluate(evaluateBodySchema.parse(toEvaluateBody(base)), shipped(slug), north);
          for (const branching of ['primary', 'secondary', 'tertiary'] as const) {
            for (const position of ['beyond-silhouette', 'at-silhouette', 'interior'] as const) {
              for (const extra of [
                { candleStrength: 'strong' as const, backBuds: true },
                { candleStrength: 'weak' as const, backBuds: false },
              ]) {
                const body = toEvaluateBody({ ...base, branching, position, ...extra });
                // Nothing skipped reaches the engine…
                expect(body).toEqual(toEvaluateBody(base));
                // …and the engine itself ignores them in recovery.
                const direct = evaluate({ ...evaluateBodySchema.parse(body), branching, position, ...extra }, shipped(slug), north);
                expect(direct).toEqual(reference);
              }
            }
          }
        }
      }
    }
  });

  it('is accepted by the evaluate schema without a branching, but a growing tree still needs one', () => {
    expect(evaluateBodySchema.safeParse({ species: 'pinus-sylvestris', date: '2027-05-10', shoot: 'candle-extending', health: 'weak' }).success).toBe(true);
    const r = evaluateBodySchema.safeParse({ species: 'pinus-sylvestris', date: '2027-05-10', shoot: 'candle-extending', health: 'average' });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].path).toEqual(['branching']);
  });
});

describe('ask machine: trees first', () => {
  it('asks which tree first, fills in species, pot and collection, and skips the species question', async () => {
    const { actor, calls, step } = start({ answers: { date: '2027-05-10' }, trees: wrenTrees });
    expect(step()).toBe('tree');
    expect(disabledReason('tree', actor.getSnapshot().context.answers)).toMatch(/Pick one of your trees/);
    actor.send({ type: 'PICK_TREE', treeId: 'tree-a' });
    const a = actor.getSnapshot().context.answers;
    expect(a).toMatchObject({ tree: 'tree-a', species: 'pinus-sylvestris', container: { shape: 'oval', lengthCm: 40, widthCm: 30 } });
    expect(actor.getSnapshot().context.treeId).toBe('tree-a');
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('health');
    actor.send({ type: 'BACK' });
    expect(step()).toBe('tree');
    // Another tree replaces everything the first one filled in.
    actor.send({ type: 'PICK_TREE', treeId: 'tree-b' });
    expect(actor.getSnapshot().context.answers).toMatchObject({ tree: 'tree-b', species: 'pinus-mugo', recentlyCollected: true });
    expect(actor.getSnapshot().context.answers.container).toBeUndefined();
    actor.send({ type: 'NEXT' });
    actor.send({ type: 'SET', answers: { health: 'average' } });
    actor.send({ type: 'NEXT' });
    actor.send({ type: 'SET', answers: { shoot: 'candle-extending' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('when');
    actor.send({ type: 'NEXT' });
    await waitFor(actor, (x) => x.matches('answer'));
    actor.send({ type: 'SAVE', visibility: 'private' });
    await waitFor(actor, (x) => x.context.saved !== null);
    expect(calls.save[0].treeId).toBe('tree-b');
    expect(calls.save[0].body.recentlyCollected).toBe(true);
  });

  it('"not one of mine" asks the species and saves without a tree', () => {
    const { actor, step } = start({ answers: { date: '2027-05-10' }, trees: wrenTrees });
    actor.send({ type: 'PICK_TREE', treeId: 'tree-a' });
    actor.send({ type: 'PICK_TREE', treeId: null });
    expect(actor.getSnapshot().context.answers).toEqual({ date: '2027-05-10', tree: 'none' });
    expect(actor.getSnapshot().context.treeId).toBeUndefined();
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('species');
  });

  it('asks the species of a tree whose species the wizard does not know, and ignores a tree that is not in the list', () => {
    const { actor, step } = start({ answers: { date: '2027-05-10' }, trees: wrenTrees });
    actor.send({ type: 'PICK_TREE', treeId: 'tree-zzz' });
    expect(actor.getSnapshot().context.answers.tree).toBeUndefined();
    actor.send({ type: 'PICK_TREE', treeId: 'tree-c' });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('species');
  });

  it('does not ask about trees of a member who has none', () => {
    expect(start({ answers: { date: '2027-05-10' } }).step()).toBe('species');
    expect(firstOpenStep({})).toBe('species');
    expect(firstOpenStep({}, { hasTrees: true })).toBe('tree');
  });
});

describe('ask machine: fresh start, the offer to continue, and start over', () => {
  const run = { answers: { ...full, date: '2027-05-09' }, treeId: undefined, step: 'position' as const, updatedAt: '2027-05-09T10:00:00Z' };

  it('offers an unfinished run and carries on where it stopped', () => {
    const { actor, step } = start({ answers: { date: '2027-05-10' }, today: '2027-05-10', resume: run });
    expect(actor.getSnapshot().matches('offering')).toBe(true);
    actor.send({ type: 'NEXT' }); // nothing moves until the member chooses
    expect(actor.getSnapshot().matches('offering')).toBe(true);
    actor.send({ type: 'CONTINUE' });
    expect(actor.getSnapshot().matches('asking')).toBe(true);
    expect(step()).toBe('position');
    expect(actor.getSnapshot().context.answers).toEqual(run.answers);
  });

  it('starts fresh when the offer is declined, with today’s date', () => {
    const { actor, step } = start({ answers: { date: '2027-05-10' }, today: '2027-05-10', resume: run, trees: wrenTrees });
    actor.send({ type: 'RESTART' });
    expect(actor.getSnapshot().matches('asking')).toBe(true);
    expect(step()).toBe('tree');
    expect(actor.getSnapshot().context.answers).toEqual({ date: '2027-05-10' });
  });

  it('has "start over" on every step and on the answer, forgetting the tree too', async () => {
    for (const at of ['health', 'shoot', 'branching', 'position', 'when'] as const) {
      const { actor, step } = start({
        answers: { ...full, tree: 'tree-a', treeSpecies: 'pinus-sylvestris' },
        treeId: 'tree-a',
        trees: wrenTrees,
        today: '2027-05-11',
        step: at,
      });
      expect(step()).toBe(at);
      actor.send({ type: 'RESTART' });
      expect(step()).toBe('tree');
      expect(actor.getSnapshot().context).toMatchObject({ answers: { date: '2027-05-11' }, treeId: undefined });
    }
    const { actor, step } = start({ answers: { ...full }, step: 'answer' });
    await waitFor(actor, (x) => x.matches('answer'));
    actor.send({ type: 'RESTART' });
    expect(step()).toBe('species');
    expect(actor.getSnapshot().context.answers).toEqual({ date: '2027-05-10' });
  });

  it('carries on a run begun without trees (before signing in) past the tree question', async () => {
    const { actor } = start({ trees: wrenTrees, today: '2027-05-10', resume: { ...run, step: 'answer' } });
    actor.send({ type: 'CONTINUE' });
    const s = await waitFor(actor, (x) => x.matches('answer'));
    expect(s.context.answers.tree).toBe('none');
    expect(s.context.treeId).toBeUndefined();
  });

  it('drops a tree from the offered run that is no longer the member’s', () => {
    const { actor } = start({
      resume: { ...run, answers: { ...run.answers, tree: 'tree-gone', treeSpecies: 'pinus-sylvestris' }, treeId: 'tree-gone' },
      trees: wrenTrees,
    });
    actor.send({ type: 'CONTINUE' });
    expect(actor.getSnapshot().context.treeId).toBeUndefined();
    expect(actor.getSnapshot().context.step).toBe('tree');
  });
});

describe('why Next is disabled', () => {
  it('names what is missing on each step', () => {
    expect(disabledReason('species', {})).toBe('Choose the species from the list');
    expect(disabledReason('health', {})).toBe('Say how the tree is doing');
    expect(disabledReason('shoot', {})).toBe('Pick what the shoot looks like');
    expect(disabledReason('branching', {})).toBe('Pick how far the branching goes');
    expect(disabledReason('position', {})).toBe('Pick where the shoot is against the outline');
    expect(disabledReason('when', { ...full, date: undefined })).toBe('Pick a date');
    expect(disabledReason('when', { ...full, date: '2027-02-30' })).toBe('Give a real date as YYYY-MM-DD.');
    expect(disabledReason('when', full)).toBeNull();
  });

  it('holds the last question until the pot has what its shape needs', () => {
    expect(disabledReason('when', { ...full, container: { shape: 'rectangle', lengthCm: 40 } })).toBe('Give the pot’s width');
    expect(disabledReason('when', { ...full, container: { shape: 'round', lengthCm: NaN } })).toBe('Give the pot’s diameter');
    expect(disabledReason('when', { ...full, container: { shape: 'oval', lengthCm: 401, widthCm: 30 } })).toMatch(/400 cm at most/);
    expect(disabledReason('when', { ...full, latitude: 95 })).toMatch(/-90 to 90/);
    expect(disabledReason('when', { ...full, hemisphere: 'south', latitude: 45 })).toMatch(/disagree/);
    const { actor } = start({ answers: { ...full, container: { shape: 'rectangle', lengthCm: 40 } } });
    actor.send({ type: 'NEXT' });
    expect(actor.getSnapshot().matches('asking')).toBe(true);
    actor.send({ type: 'SET', answers: { container: { shape: 'round', lengthCm: 30 } } });
    actor.send({ type: 'NEXT' });
    expect(actor.getSnapshot().matches('evaluating')).toBe(true);
  });

  it('drops follow-up answers that do not apply', () => {
    expect(toEvaluateBody({ ...full, backBuds: true }).backBuds).toBeUndefined();
    expect(toEvaluateBody({ ...full, branching: 'primary', shoot: 'needles-hardened', backBuds: false }).backBuds).toBe(false);
    expect(toEvaluateBody({ ...full, shoot: 'dormant-bud', candleStrength: 'strong' }).candleStrength).toBeUndefined();
  });
});

describe('saving', () => {
  it('saves with note, visibility and tree', async () => {
    const { actor, calls } = start({ answers: { ...full }, step: 'answer', treeId: 'tree-1' });
    await waitFor(actor, (x) => x.matches('answer'));
    actor.send({ type: 'SAVE', note: 'south branch', visibility: 'club' });
    const s = await waitFor(actor, (x) => x.matches('answer') && x.context.saved !== null);
    expect(s.context.saved?.url).toBe('/answers/abcdefghijkl');
    expect(calls.save[0]).toEqual({ body: { ...full }, note: 'south branch', visibility: 'club', treeId: 'tree-1' });
  });
});
