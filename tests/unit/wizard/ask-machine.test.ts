import { describe, expect, it } from 'vitest';
import { createActor, fromPromise, waitFor } from 'xstate';
import { askMachine, canReach, firstOpenStep, toEvaluateBody, type AskAnswers, type SaveRequest } from '@/lib/wizard/ask.machine';
import { evaluate } from '@/lib/wizard/engine';
import type { EvaluateBody } from '@/lib/validation/wizard';
import { north, scots } from '../../support/wizard-fixtures';

function start(input: Parameters<typeof createActor<typeof askMachine>>[1] extends infer O ? (O extends { input?: infer I } ? I : never) : never = {}) {
  const calls: { evaluate: EvaluateBody[]; save: SaveRequest[] } = { evaluate: [], save: [] };
  const machine = askMachine.provide({
    actors: {
      evaluate: fromPromise(async ({ input }: { input: EvaluateBody }) => {
        calls.evaluate.push(input);
        if (input.species === 'pinus-unknown') throw new Error('We have no published species with that name.');
        return evaluate(input, scots, north);
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
  species: 'pinus-sylvestris', branching: 'tertiary', shoot: 'candle-extending', position: 'beyond-silhouette',
  health: 'average', date: '2027-05-10',
};

describe('ask machine', () => {
  it('walks the steps in order and evaluates at the end', async () => {
    const { actor, calls, step } = start({ answers: { date: '2027-05-10' } });
    expect(step()).toBe('species');
    actor.send({ type: 'NEXT' }); // not answered: stays
    expect(step()).toBe('species');
    actor.send({ type: 'SET', answers: { species: 'pinus-sylvestris' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('branching');
    actor.send({ type: 'SET', answers: { branching: 'tertiary' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('shoot');
    actor.send({ type: 'SET', answers: { shoot: 'candle-extending' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('position');
    actor.send({ type: 'SET', answers: { position: 'beyond-silhouette' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('health');
    actor.send({ type: 'SET', answers: { health: 'average' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('when');
    actor.send({ type: 'NEXT' });
    const s = await waitFor(actor, (x) => x.matches('answer'));
    expect(s.context.step).toBe('answer');
    expect(s.context.result?.action).toBe('pinch');
    expect(calls.evaluate).toEqual([{ ...full }]);
  });

  it('skips the silhouette question for a development branch and leaves the position out', async () => {
    const { actor, calls, step } = start({ answers: { species: 'pinus-sylvestris', branching: 'secondary', date: '2027-08-20', position: 'interior' }, step: 'shoot' });
    actor.send({ type: 'SET', answers: { shoot: 'needles-hardened' } });
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('health');
    actor.send({ type: 'BACK' });
    expect(step()).toBe('shoot');
    actor.send({ type: 'NEXT' });
    actor.send({ type: 'SET', answers: { health: 'strong', backBuds: true } });
    actor.send({ type: 'NEXT' });
    actor.send({ type: 'NEXT' });
    await waitFor(actor, (x) => x.matches('answer'));
    expect(calls.evaluate[0].position).toBeUndefined();
    expect(calls.evaluate[0].backBuds).toBe(true);
    expect(actor.getSnapshot().context.result?.action).toBe('prune');
  });

  it('passes "repotted this year" and the candle strength to the engine, so a repotted black pine is not decandled', async () => {
    const { actor, calls } = start({
      answers: { species: 'pinus-thunbergii', branching: 'tertiary', shoot: 'needles-opening', position: 'beyond-silhouette', date: '2027-06-20' },
      step: 'health',
    });
    actor.send({ type: 'SET', answers: { health: 'strong', repottedThisYear: true, candleStrength: 'strong' } });
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
    actor.send({ type: 'NEXT' });
    expect(step()).toBe('health');
    expect(actor.getSnapshot().context.answers.health).toBe('average');
  });

  it('opens the step from the URL only when it can be reached', () => {
    expect(start({ answers: { species: 'pinus-sylvestris' }, step: 'health' }).step()).toBe('branching');
    expect(start({ answers: { ...full }, step: 'position' }).step()).toBe('position');
    expect(start({ answers: { ...full, branching: 'primary' }, step: 'position' }).step()).toBe('when');
    const { actor, step } = start({ answers: { species: 'pinus-sylvestris', branching: 'primary' } });
    expect(step()).toBe('shoot');
    actor.send({ type: 'GOTO', step: 'when' });
    expect(step()).toBe('shoot');
    actor.send({ type: 'GOTO', step: 'species' });
    expect(step()).toBe('species');
  });

  it('starts at the answer from the URL when everything is answered', async () => {
    const { actor } = start({ answers: { ...full }, step: 'answer' });
    const s = await waitFor(actor, (x) => x.matches('answer'));
    expect(s.context.result?.stage).toBe('refinement');
  });

  it('returns to the questions with an error when evaluation fails', async () => {
    const { actor } = start({ answers: { ...full, species: 'pinus-unknown' }, step: 'answer' });
    const s = await waitFor(actor, (x) => x.matches('asking'));
    expect(s.context.step).toBe('when');
    expect(s.context.error).toMatch(/no published species/);
  });

  it('saves with note, visibility and tree', async () => {
    const { actor, calls } = start({ answers: { ...full }, step: 'answer', treeId: 'tree-1' });
    await waitFor(actor, (x) => x.matches('answer'));
    actor.send({ type: 'SAVE', note: 'south branch', visibility: 'club' });
    const s = await waitFor(actor, (x) => x.matches('answer') && x.context.saved !== null);
    expect(s.context.saved?.url).toBe('/answers/abcdefghijkl');
    expect(calls.save[0]).toEqual({ body: { ...full }, note: 'south branch', visibility: 'club', treeId: 'tree-1' });
  });

  it('goes back from the answer to the last question and can restart', async () => {
    const { actor, step } = start({ answers: { ...full }, step: 'answer' });
    await waitFor(actor, (x) => x.matches('answer'));
    actor.send({ type: 'BACK' });
    expect(actor.getSnapshot().matches('asking')).toBe(true);
    expect(step()).toBe('when');
    actor.send({ type: 'NEXT' });
    await waitFor(actor, (x) => x.matches('answer'));
    actor.send({ type: 'RESTART' });
    expect(step()).toBe('species');
    expect(actor.getSnapshot().context.answers).toEqual({ date: '2027-05-10' });
  });
});

describe('ask helpers', () => {
  it('finds the first open question, ignoring irrelevant ones', () => {
    expect(firstOpenStep({})).toBe('species');
    expect(firstOpenStep({ species: 'x', branching: 'primary', shoot: 'dormant-bud' })).toBe('health');
    expect(firstOpenStep({ species: 'x', branching: 'tertiary', shoot: 'dormant-bud' })).toBe('position');
    expect(canReach('when', { species: 'x', branching: 'primary', shoot: 'dormant-bud', health: 'weak' })).toBe(true);
  });
  it('drops back-bud answers that do not apply', () => {
    expect(toEvaluateBody({ ...full, backBuds: true }).backBuds).toBeUndefined();
    expect(toEvaluateBody({ ...full, branching: 'primary', shoot: 'needles-hardened', backBuds: false }).backBuds).toBe(false);
  });
});

describe('pot dimensions', () => {
  it('holds the last question until the pot has the dimensions its shape needs', () => {
    const { actor, step } = start({ answers: { ...full, container: { shape: 'rectangle', lengthCm: 40 } } });
    expect(step()).toBe('when');
    actor.send({ type: 'NEXT' });
    expect(actor.getSnapshot().matches('asking')).toBe(true);
    actor.send({ type: 'SET', answers: { container: { shape: 'round', lengthCm: 30 } } });
    actor.send({ type: 'NEXT' });
    expect(actor.getSnapshot().matches('evaluating')).toBe(true);
  });
});
