import { assign, fromPromise, setup } from 'xstate';
import type { EvaluateBody } from '@/lib/validation/wizard';
import type { Branching, CandleStrength, ContainerInput, Health, Hemisphere, Position, ShootState, WizardResult } from './types';

// The /ask wizard as a state machine. Pure: evaluating and saving are actors the page injects
// (machine.provide), so the machine is tested with createActor and no network.

export const askSteps = ['species', 'branching', 'shoot', 'position', 'health', 'when', 'answer'] as const;
export type AskStep = (typeof askSteps)[number];
export type QuestionStep = Exclude<AskStep, 'answer'>;

export interface AskAnswers {
  species?: string;
  branching?: Branching;
  shoot?: ShootState;
  position?: Position;
  health?: Health;
  recentlyCollected?: boolean;
  backBuds?: boolean;
  /** Optional: a tree repotted this year is never decandled. */
  repottedThisYear?: boolean;
  /** Optional: this candle against the others on the tree (the engine assumes average). */
  candleStrength?: CandleStrength;
  date?: string;
  hemisphere?: Hemisphere;
  latitude?: number;
  container?: ContainerInput;
}

/** A question the answers so far make irrelevant is skipped (position: only for a refinement branch). */
export function isRelevant(step: AskStep, a: AskAnswers): boolean {
  if (step === 'position') return a.branching === undefined || a.branching === 'tertiary';
  return true;
}

/** The back-bud question only matters for a development branch whose needles have hardened. */
export function asksBackBuds(a: AskAnswers): boolean {
  return a.branching !== undefined && a.branching !== 'tertiary' && a.shoot === 'needles-hardened';
}

/** No pot, or a pot with every dimension its shape needs. */
export function containerComplete(c: ContainerInput | undefined): boolean {
  if (!c) return true;
  const ok = (n: number | undefined) => typeof n === 'number' && Number.isFinite(n) && n > 0;
  return ok(c.lengthCm) && (c.shape === 'round' || ok(c.widthCm));
}

export function isAnswered(step: AskStep, a: AskAnswers): boolean {
  switch (step) {
    case 'species': return !!a.species;
    case 'branching': return !!a.branching;
    case 'shoot': return !!a.shoot;
    case 'position': return !!a.position;
    case 'health': return !!a.health;
    case 'when': return !!a.date && /^\d{4}-\d{2}-\d{2}$/.test(a.date) && containerComplete(a.container);
    case 'answer': return false;
  }
}

export function nextStep(step: AskStep, a: AskAnswers): AskStep {
  let i = askSteps.indexOf(step) + 1;
  while (i < askSteps.length - 1 && !isRelevant(askSteps[i], a)) i++;
  return askSteps[Math.min(i, askSteps.length - 1)];
}

export function prevStep(step: AskStep, a: AskAnswers): AskStep {
  let i = askSteps.indexOf(step) - 1;
  while (i > 0 && !isRelevant(askSteps[i], a)) i--;
  return askSteps[Math.max(i, 0)];
}

/** The first relevant question not yet answered, or 'answer' when all are. */
export function firstOpenStep(a: AskAnswers): AskStep {
  return askSteps.find((s) => s !== 'answer' && isRelevant(s, a) && !isAnswered(s, a)) ?? 'answer';
}

/** A step can be opened (from the URL or the back button) once every relevant step before it is answered. */
export function canReach(step: AskStep, a: AskAnswers): boolean {
  const i = askSteps.indexOf(step);
  return askSteps.slice(0, i).every((s) => !isRelevant(s, a) || isAnswered(s, a));
}

/** The evaluate body for the answers; irrelevant answers are left out. */
export function toEvaluateBody(a: AskAnswers): EvaluateBody {
  const body: EvaluateBody = {
    species: a.species!,
    branching: a.branching!,
    date: a.date!,
    shoot: a.shoot!,
    health: a.health!,
  };
  if (a.branching === 'tertiary') body.position = a.position;
  if (a.hemisphere) body.hemisphere = a.hemisphere;
  if (typeof a.latitude === 'number') body.latitude = a.latitude;
  if (a.recentlyCollected) body.recentlyCollected = true;
  if (a.repottedThisYear) body.repottedThisYear = true;
  if (a.candleStrength) body.candleStrength = a.candleStrength;
  if (asksBackBuds(a) && typeof a.backBuds === 'boolean') body.backBuds = a.backBuds;
  if (a.container) body.container = a.container;
  return body;
}

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
  result: WizardResult | null;
  error: string | null;
  saved: { id: string; url: string } | null;
  saveError: string | null;
}

export type AskEvent =
  | { type: 'SET'; answers: Partial<AskAnswers> }
  | { type: 'NEXT' }
  | { type: 'BACK' }
  | { type: 'GOTO'; step: AskStep }
  | { type: 'SAVE'; note?: string; visibility: 'private' | 'club' }
  | { type: 'RESTART' };

export interface AskInput {
  answers?: AskAnswers;
  treeId?: string;
  /** Open at this step if it can be reached; otherwise at the first open question. */
  step?: AskStep;
}

const errorText = (e: unknown) => (e instanceof Error ? e.message : 'Something went wrong.');

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
    stepAnswered: ({ context }) => isAnswered(context.step, context.answers),
    nextIsAnswer: ({ context }) => isAnswered(context.step, context.answers) && nextStep(context.step, context.answers) === 'answer',
    gotoAnswer: ({ context, event }) => event.type === 'GOTO' && event.step === 'answer' && firstOpenStep(context.answers) === 'answer',
    gotoQuestion: ({ context, event }) =>
      event.type === 'GOTO' && event.step !== 'answer' && isRelevant(event.step, context.answers) && canReach(event.step, context.answers),
    startsComplete: ({ context }) => context.step === 'answer',
  },
  actions: {
    setAnswers: assign({
      answers: ({ context, event }) => (event.type === 'SET' ? { ...context.answers, ...event.answers } : context.answers),
      error: null,
    }),
    goNext: assign({ step: ({ context }) => nextStep(context.step, context.answers) }),
    goBack: assign({ step: ({ context }) => prevStep(context.step, context.answers) }),
    goTo: assign({ step: ({ event }) => (event.type === 'GOTO' ? event.step : 'species') }),
  },
}).createMachine({
  id: 'ask',
  context: ({ input }) => {
    const answers = input.answers ?? {};
    const open = firstOpenStep(answers);
    // Pre-filled species (from a tree or a link): start at the first real question.
    let step: AskStep = open;
    if (input.step && input.step !== 'answer' && isRelevant(input.step, answers) && canReach(input.step, answers)) step = input.step;
    // All answered: show the answer only when asked for it, else the last question.
    if (step === 'answer' && input.step !== 'answer') step = 'when';
    return { step, answers, treeId: input.treeId, result: null, error: null, saved: null, saveError: null };
  },
  initial: 'routing',
  states: {
    routing: {
      always: [{ guard: 'startsComplete', target: 'evaluating' }, { target: 'asking' }],
    },
    asking: {
      on: {
        SET: { actions: 'setAnswers' },
        NEXT: [
          { guard: 'nextIsAnswer', target: 'evaluating' },
          { guard: 'stepAnswered', actions: 'goNext' },
        ],
        BACK: { actions: 'goBack' },
        GOTO: [
          { guard: 'gotoAnswer', target: 'evaluating' },
          { guard: 'gotoQuestion', actions: 'goTo' },
        ],
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
        BACK: { target: 'asking', actions: assign({ step: ({ context }) => prevStep('answer', context.answers) }) },
        GOTO: { guard: 'gotoQuestion', target: 'asking', actions: 'goTo' },
        SAVE: 'saving',
        RESTART: { target: 'asking', actions: assign({ step: 'species' as AskStep, answers: ({ context }) => ({ date: context.answers.date }), result: null, saved: null, treeId: undefined }) },
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
