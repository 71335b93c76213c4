'use client';
import { useEffect, useRef, useState } from 'react';
import Link from 'next/link';
import { useSearchParams } from 'next/navigation';
import { useMachine } from '@xstate/react';
import { fromPromise } from 'xstate';
import { askMachine, askSteps, isRelevant, type AskAnswers, type AskStep, type SaveRequest } from '@/lib/wizard/ask.machine';
import type { EvaluateBody } from '@/lib/validation/wizard';
import { AnswerResult } from '@/components/wizard/answer-result';
import { LiquidFeedCalculator } from '@/components/wizard/liquid-feed-calculator';
import { BranchingStep, HealthStep, PositionStep, ShootStep, SpeciesStep, WhenStep, type SpeciesName } from './question-steps';
import { SaveAnswer } from './save-answer';
import { evaluateAnywhere, saveAnywhere } from '@/components/offline/evaluate-anywhere';
import { WorkedOutOnPhone } from '@/components/offline/worked-out-on-phone';

const STORAGE_KEY = 'candlewise.ask.v1';

const stepTitles: Record<AskStep, string> = {
  species: 'Tree', branching: 'Branching', shoot: 'Shoot', position: 'Outline', health: 'Health', when: 'When and where', answer: 'Answer',
};

const machine = askMachine.provide({
  actors: {
    // With no signal the phone works the answer out itself and queues the save (components/offline).
    evaluate: fromPromise(({ input }: { input: EvaluateBody }) => evaluateAnywhere(input)),
    save: fromPromise(({ input }: { input: SaveRequest }) => saveAnywhere(input)),
  },
});

export interface AskWizardProps {
  species: SpeciesName[];
  prefill: AskAnswers;
  treeId?: string;
  treeName?: string;
  club: { hemisphere: 'north' | 'south'; latitude: number; name: string };
  today: string;
  signedIn: boolean;
}

/** Client-only: the answers so far live in sessionStorage, so a refresh keeps them. */
export function AskWizard(props: AskWizardProps) {
  const [boot, setBoot] = useState<{ answers: AskAnswers; treeId?: string; step?: AskStep } | null>(null);
  const params = useSearchParams();
  useEffect(() => {
    let stored: { answers?: AskAnswers; treeId?: string } = {};
    try {
      stored = JSON.parse(sessionStorage.getItem(STORAGE_KEY) ?? '{}');
    } catch {}
    const fresh = props.prefill.species && stored.answers?.species !== props.prefill.species;
    const answers = { date: props.today, ...(fresh ? props.prefill : { ...props.prefill, ...stored.answers }) };
    const step = params.get('step') as AskStep | null;
    setBoot({ answers, treeId: props.treeId ?? (fresh ? undefined : stored.treeId), step: step && askSteps.includes(step) ? step : undefined });
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  if (!boot) return <p className="text-stone-700" data-testid="ask-loading">Loading the questions…</p>;
  return <Wizard {...props} boot={boot} />;
}

function Wizard({ boot, species, club, signedIn, treeName }: AskWizardProps & { boot: { answers: AskAnswers; treeId?: string; step?: AskStep } }) {
  const [snap, send, actorRef] = useMachine(machine, { input: boot });
  const params = useSearchParams();
  const { step, answers, result, error } = snap.context;
  const urlStep = params.get('step');
  const firstSync = useRef(true);

  useEffect(() => {
    sessionStorage.setItem(STORAGE_KEY, JSON.stringify({ answers, treeId: snap.context.treeId }));
  }, [answers, snap.context.treeId]);

  // Machine → URL: a new step is a new history entry, so the browser's back button walks the steps.
  useEffect(() => {
    if (snap.matches('evaluating') || snap.matches('saving')) return;
    const current = new URLSearchParams(window.location.search);
    const first = firstSync.current;
    firstSync.current = false;
    if (current.get('step') === step) return;
    current.set('step', step);
    const url = `${window.location.pathname}?${current.toString()}`;
    // The opening step replaces the entry it was loaded at; every later step is a new entry.
    if (first) window.history.replaceState(null, '', url);
    else window.history.pushState(null, '', url);
  }, [step, snap]);

  // URL → machine: the back and forward buttons change ?step=.
  useEffect(() => {
    if (!urlStep || urlStep === step) return;
    if (askSteps.includes(urlStep as AskStep)) send({ type: 'GOTO', step: urlStep as AskStep });
    // A step that cannot be opened yet (or a made-up one): show where the machine actually is.
    const now = actorRef.getSnapshot();
    if (!now.matches('evaluating') && now.context.step !== urlStep) {
      const current = new URLSearchParams(window.location.search);
      current.set('step', now.context.step);
      window.history.replaceState(null, '', `${window.location.pathname}?${current.toString()}`);
    }
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [urlStep]);

  const set = (a: Partial<AskAnswers>) => send({ type: 'SET', answers: a });
  const visible = askSteps.filter((s) => s !== 'answer' && isRelevant(s, answers));
  const index = visible.indexOf(step as (typeof visible)[number]);
  const busy = snap.matches('evaluating');

  const heading = useRef<HTMLDivElement>(null);
  useEffect(() => {
    heading.current?.focus();
  }, [step]);

  return (
    <div className="mx-auto max-w-xl pb-28">
      <div ref={heading} tabIndex={-1} className="outline-none">
        {step !== 'answer' ? (
          <p className="mb-3 text-sm font-medium text-stone-700" data-testid="ask-progress">
            Question {index + 1} of {visible.length} · {stepTitles[step]}
            {treeName && <> · for <strong>{treeName}</strong></>}
          </p>
        ) : null}
      </div>
      {error && <p role="alert" className="mb-4 rounded-lg bg-clay-100 p-3 text-clay-700">{error}</p>}

      <div data-testid={`ask-step-${step}`}>
        {step === 'species' && <SpeciesStep species={species} value={answers.species} onChange={set} />}
        {step === 'branching' && <BranchingStep value={answers.branching} onChange={set} />}
        {step === 'shoot' && <ShootStep value={answers.shoot} onChange={set} />}
        {step === 'position' && <PositionStep value={answers.position} onChange={set} />}
        {step === 'health' && <HealthStep answers={answers} onChange={set} />}
        {step === 'when' && <WhenStep answers={answers} club={club} onChange={set} />}
        {step === 'answer' && busy && <p className="text-lg" aria-live="polite">Working out the answer…</p>}
        {step === 'answer' && result && !busy && (
          <div className="space-y-5">
            <WorkedOutOnPhone result={result} />
            <AnswerResult result={result} />
            <SaveAnswer
              signedIn={signedIn}
              saving={snap.matches('saving')}
              saved={snap.context.saved}
              error={snap.context.saveError}
              onSave={(note, visibility) => send({ type: 'SAVE', note, visibility })}
            />
            <LiquidFeedCalculator />
            <div className="flex flex-wrap gap-3">
              <button type="button" className="btn-secondary" onClick={() => send({ type: 'BACK' })}>Change my answers</button>
              <button type="button" className="btn-secondary" onClick={() => send({ type: 'RESTART' })}>Ask about another shoot</button>
              {signedIn && <Link href="/answers" className="btn-secondary">My answers</Link>}
            </div>
          </div>
        )}
      </div>

      {step !== 'answer' && (
        <nav aria-label="Wizard steps" className="fixed inset-x-0 bottom-0 z-10 border-t border-stone-200 bg-white/95 p-3 backdrop-blur">
          <div className="mx-auto flex max-w-xl gap-3">
            <button type="button" className="btn-secondary flex-1 text-lg" onClick={() => send({ type: 'BACK' })} disabled={step === 'species'}>
              Back
            </button>
            <button type="button" className="btn-primary flex-[2] text-lg" data-testid="ask-next" onClick={() => send({ type: 'NEXT' })} disabled={!snap.can({ type: 'NEXT' }) || busy}>
              {step === 'when' ? 'Show the answer' : 'Next'}
            </button>
          </div>
        </nav>
      )}
    </div>
  );
}
