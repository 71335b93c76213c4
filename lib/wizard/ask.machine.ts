import { assign, fromPromise, setup } from 'xstate';
import type { EvaluateBody } from '@/lib/validation/wizard';
import type { WizardResult } from './types';
import {
  answersForTree,
  canReach,
  resumedAnswers,
  firstOpenStep,
  firstStep,
  isAnswered,
  isRelevant,
  nextStep,
  NOT_MINE,
  prevStep,
  toEvaluateBody,
  type AskAnswers,
  type AskStep,
  type Flow,
  type TreeOption,
} from './ask-steps';
import type { StoredRun } from './ask-resume';

export * from './ask-steps';

// The /ask wizard as a state machine. Pure: evaluating and saving are actors the page injects
// (machine.provide), so the machine is tested with createActor and no network.

export interface SaveRequest {
  body: EvaluateBody;
  note?: string;
  visibility: 'private' | 'club';
  treeId?: string;
}

export interface AskContext {
  step: AskStep;
  answers: AskAnswers;
  treeId?: string;
  trees: TreeOption[];
  /** Today's date: a fresh run starts with it. */
  today?: string;
  /** An unfinished run offered back ("Continue with …?") until the member picks. */
  resume: StoredRun | null;
  result: WizardResult | null;
  error: string | null;
  saved: { id: string; url: string } | null;
  saveError: string | null;
}

export type AskEvent =
  | { type: 'SET'; answers: Partial<AskAnswers> }
  | { type: 'PICK_TREE'; treeId: string | null }
  | { type: 'NEXT' }
  | { type: 'BACK' }
  | { type: 'GOTO'; step: AskStep }
  | { type: 'SAVE'; note?: string; visibility: 'private' | 'club' }
  | { type: 'CONTINUE' }
  | { type: 'RESTART' };

export interface AskInput {
  answers?: AskAnswers;
  treeId?: string;
  /** Open at this step if it can be reached; otherwise at the first open question. */
  step?: AskStep;
  /** The member's trees: with any, the first question is which of them this is. */
  trees?: TreeOption[];
  today?: string;
  /** An unfinished run to offer back before anything else. */
  resume?: StoredRun | null;
}

const errorText = (e: unknown) => (e instanceof Error ? e.message : 'Something went wrong.');
const flowOf = (c: { trees: TreeOption[] }): Flow => ({ hasTrees: c.trees.length > 0 });

/** Where a run with these answers opens: the asked-for step if it can be reached, else the first open question. */
function openingStep(answers: AskAnswers, f: Flow, wanted?: AskStep): AskStep {
  const open = firstOpenStep(answers, f);
  let step: AskStep = open;
  if (wanted && wanted !== 'answer' && isRelevant(wanted, answers, f) && canReach(wanted, answers, f)) step = wanted;
  // All answered: show the answer only when asked for it, else the last question.
  if (step === 'answer' && wanted !== 'answer') step = 'when';
  return step;
}

function freshAnswers(c: { today?: string; answers: AskAnswers }): AskAnswers {
  const date = c.today ?? c.answers.date;
  return date ? { date } : {};
}

export const askMachine = setup({
  types: {
    context: {} as AskContext,
    events: {} as AskEvent,
    input: {} as AskInput,
  },
  actors: {
    evaluate: fromPromise<WizardResult, EvaluateBody>(async () => {
      throw new Error('No evaluator provided');
    }),
    save: fromPromise<{ id: string; url: string }, SaveRequest>(async () => {
      throw new Error('No saver provided');
    }),
  },
  guards: {
    offering: ({ context }) => context.resume !== null,
    stepAnswered: ({ context }) => isAnswered(context.step, context.answers),
    nextIsAnswer: ({ context }) => isAnswered(context.step, context.answers) && nextStep(context.step, context.answers, flowOf(context)) === 'answer',
    gotoAnswer: ({ context, event }) => event.type === 'GOTO' && event.step === 'answer' && firstOpenStep(context.answers, flowOf(context)) === 'answer',
    gotoQuestion: ({ context, event }) =>
      event.type === 'GOTO' &&
      event.step !== 'answer' &&
      isRelevant(event.step, context.answers, flowOf(context)) &&
      canReach(event.step, context.answers, flowOf(context)),
    startsComplete: ({ context }) => context.step === 'answer',
  },
  actions: {
    setAnswers: assign({
      answers: ({ context, event }) => (event.type === 'SET' ? { ...context.answers, ...event.answers } : context.answers),
      error: null,
    }),
    pickTree: assign(({ context, event }) => {
      if (event.type !== 'PICK_TREE') return {};
      const tree = event.treeId ? (context.trees.find((t) => t.id === event.treeId) ?? null) : null;
      if (event.treeId && !tree) return {};
      if (context.answers.tree === (tree?.id ?? NOT_MINE)) return {};
      return { answers: answersForTree(context.answers, tree), treeId: tree?.id, error: null };
    }),
    goNext: assign({ step: ({ context }) => nextStep(context.step, context.answers, flowOf(context)) }),
    goBack: assign({ step: ({ context }) => prevStep(context.step, context.answers, flowOf(context)) }),
    goTo: assign({ step: ({ event }) => (event.type === 'GOTO' ? event.step : 'species') }),
    restart: assign(({ context }) => {
      const answers = freshAnswers(context);
      return { answers, step: firstStep(answers, flowOf(context)), treeId: undefined, result: null, saved: null, saveError: null, error: null, resume: null };
    }),
    resumeRun: assign(({ context }) => {
      const run = context.resume;
      if (!run) return {};
      const treeId = run.treeId && context.trees.some((t) => t.id === run.treeId) ? run.treeId : undefined;
      const answers = resumedAnswers({ ...run.answers }, flowOf(context));
      // A tree that is no longer the member's is not offered back.
      if (answers.tree && answers.tree !== NOT_MINE && !treeId) delete answers.tree;
      return { answers, treeId, step: openingStep(answers, flowOf(context), run.step), resume: null };
    }),
  },
}).createMachine({
  id: 'ask',
  context: ({ input }) => {
    const trees = input.trees ?? [];
    const answers = input.answers ?? (input.today ? { date: input.today } : {});
    const step = openingStep(answers, { hasTrees: trees.length > 0 }, input.step);
    return {
      step,
      answers,
      treeId: input.treeId,
      trees,
      today: input.today,
      resume: input.resume ?? null,
      result: null,
      error: null,
      saved: null,
      saveError: null,
    };
  },
  initial: 'routing',
  states: {
    routing: {
      always: [{ guard: 'offering', target: 'offering' }, { guard: 'startsComplete', target: 'evaluating' }, { target: 'asking' }],
    },
    offering: {
      on: {
        CONTINUE: { target: 'routing', actions: 'resumeRun' },
        RESTART: { target: 'asking', actions: 'restart' },
      },
    },
    asking: {
      on: {
        SET: { actions: 'setAnswers' },
        PICK_TREE: { actions: 'pickTree' },
        NEXT: [
          { guard: 'nextIsAnswer', target: 'evaluating' },
          { guard: 'stepAnswered', actions: 'goNext' },
        ],
        BACK: { actions: 'goBack' },
        GOTO: [
          { guard: 'gotoAnswer', target: 'evaluating' },
          { guard: 'gotoQuestion', actions: 'goTo' },
        ],
        RESTART: { actions: 'restart' },
      },
    },
    evaluating: {
      entry: assign({ step: 'answer' as AskStep, error: null }),
      invoke: {
        src: 'evaluate',
        input: ({ context }) => toEvaluateBody(context.answers),
        onDone: { target: 'answer', actions: assign({ result: ({ event }) => event.output, saved: null, saveError: null }) },
        onError: { target: 'asking', actions: assign({ step: 'when' as AskStep, error: ({ event }) => errorText(event.error) }) },
      },
    },
    answer: {
      on: {
        BACK: { target: 'asking', actions: assign({ step: ({ context }) => prevStep('answer', context.answers, flowOf(context)) }) },
        GOTO: { guard: 'gotoQuestion', target: 'asking', actions: 'goTo' },
        SAVE: 'saving',
        RESTART: { target: 'asking', actions: 'restart' },
      },
    },
    saving: {
      invoke: {
        src: 'save',
        input: ({ context, event }) => ({
          body: toEvaluateBody(context.answers),
          note: event.type === 'SAVE' ? event.note : undefined,
          visibility: event.type === 'SAVE' ? event.visibility : 'private',
          treeId: context.treeId,
        }),
        onDone: { target: 'answer', actions: assign({ saved: ({ event }) => event.output, saveError: null }) },
        onError: { target: 'answer', actions: assign({ saveError: ({ event }) => errorText(event.error) }) },
      },
    },
  },
});
