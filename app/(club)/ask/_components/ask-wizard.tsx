'use client';
import { useEffect, useRef, useState } from 'react';
import Link from 'next/link';
import { useSearchParams } from 'next/navigation';
import { useMachine } from '@xstate/react';
import { fromPromise } from 'xstate';
import {
  askMachine,
  askSteps,
  disabledReason,
  firstStep,
  questionList,
  resumedAnswers,
  type AskAnswers,
  type AskInput,
  type AskStep,
  type SaveRequest,
  type TreeOption,
} from '@/lib/wizard/ask.machine';
import { bootPlan, freshParams, isUnfinished, resumeQuestion, type StoredRun } from '@/lib/wizard/ask-resume';
import type { EvaluateBody } from '@/lib/validation/wizard';
import { AnswerResult } from '@/components/wizard/answer-result';
import { LiquidFeedCalculator } from '@/components/wizard/liquid-feed-calculator';
import { BranchingStep, HealthStep, PositionStep, ShootStep, SpeciesStep, TreeStep, WhenStep, type SpeciesName } from './question-steps';
import { SaveAnswer } from './save-answer';
import { evaluateAnywhere, saveAnywhere } from '@/components/offline/evaluate-anywhere';
import { WorkedOutOnPhone } from '@/components/offline/worked-out-on-phone';

// localStorage, not sessionStorage: a member who closes the tab in the garden is offered the run back.
const STORAGE_KEY = 'candlewise.ask.v2';

const stepTitles: Record<AskStep, string> = {
  tree: 'Your tree',
  species: 'Species',
  health: 'Health',
  shoot: 'Shoot',
  branching: 'Branching',
  position: 'Outline',
  when: 'When and where',
  answer: 'Answer',
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
  trees: TreeOption[];
  treeId?: string;
  club: { hemisphere: 'north' | 'south'; latitude: number; name: string };
  today: string;
  signedIn: boolean;
}

function readStored(): StoredRun | null {
  try {
    const run = JSON.parse(localStorage.getItem(STORAGE_KEY) ?? 'null') as StoredRun | null;
    return isUnfinished(run) ? run : null;
  } catch {
    return null;
  }
}

const forget = () => {
  try {
    localStorage.removeItem(STORAGE_KEY);
  } catch {}
};

/** Client-only: the answers so far live in localStorage, so a refresh or a later visit can carry on. */
export function AskWizard(props: AskWizardProps) {
  const [boot, setBoot] = useState<AskInput | null>(null);
  const params = useSearchParams();
  useEffect(() => {
    const stored = readStored();
    const urlStep = params.get('step') as AskStep | null;
    const step = urlStep && askSteps.includes(urlStep) ? urlStep : undefined;
    const plan = bootPlan({ stored, freshIntent: freshParams.some((p) => params.has(p)), stepInUrl: !!step });
    const base = { trees: props.trees, today: props.today };
    if (plan === 'fresh') {
      forget();
      setBoot({ ...base, answers: { date: props.today, ...props.prefill }, treeId: props.treeId, step });
    } else if (plan === 'resume') {
      setBoot({ ...base, answers: resumedAnswers(stored!.answers, { hasTrees: props.trees.length > 0 }), treeId: stored!.treeId, step });
    } else {
      setBoot({ ...base, answers: { date: props.today }, resume: stored });
    }
    // The start link has done its work: a reload from here carries on instead of starting again.
    const url = new URLSearchParams(window.location.search);
    for (const p of freshParams) url.delete(p);
    const qs = url.toString();
    window.history.replaceState(null, '', `${window.location.pathname}${qs ? `?${qs}` : ''}`);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, []);
  if (!boot)
    return (
      <p className="text-stone-700" data-testid="ask-loading">
        Loading the questions…
      </p>
    );
  return <Wizard {...props} boot={boot} />;
}

function Wizard({ boot, species, club, signedIn, trees }: AskWizardProps & { boot: AskInput }) {
  const [snap, send, actorRef] = useMachine(machine, { input: boot });
  const params = useSearchParams();
  const { step, answers, result, error, saved, treeId } = snap.context;
  const offering = snap.matches('offering');
  const urlStep = params.get('step');
  const firstSync = useRef(true);

  useEffect(() => {
    if (offering) return;
    if (saved) return forget();
    const run: StoredRun = { answers, treeId, step, updatedAt: new Date().toISOString() };
    try {
      localStorage.setItem(STORAGE_KEY, JSON.stringify(run));
    } catch {}
  }, [answers, treeId, step, saved, offering]);

  // Machine → URL: a new step is a new history entry, so the browser's back button walks the steps.
  useEffect(() => {
    if (offering || snap.matches('evaluating') || snap.matches('saving')) return;
    const current = new URLSearchParams(window.location.search);
    const first = firstSync.current;
    firstSync.current = false;
    if (current.get('step') === step) return;
    current.set('step', step);
    const url = `${window.location.pathname}?${current.toString()}`;
    // The opening step replaces the entry it was loaded at; every later step is a new entry.
    if (first) window.history.replaceState(null, '', url);
    else window.history.pushState(null, '', url);
  }, [step, snap, offering]);

  // URL → machine: the back and forward buttons change ?step=.
  useEffect(() => {
    if (offering || !urlStep || urlStep === step) return;
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

  // The header's Ask followed while already on /ask: the same wizard starts again, fresh.
  const startParam = params.get('start');
  const bootStart = useRef(startParam);
  useEffect(() => {
    if (!startParam) {
      bootStart.current = null;
      return;
    }
    if (bootStart.current) return; // the start link this wizard was opened with
    send({ type: 'RESTART' });
    forget();
    const current = new URLSearchParams(window.location.search);
    current.delete('start');
    window.history.replaceState(null, '', `${window.location.pathname}?${current.toString()}`);
    // eslint-disable-next-line react-hooks/exhaustive-deps
  }, [startParam]);

  const set = (a: Partial<AskAnswers>) => send({ type: 'SET', answers: a });
  const flow = { hasTrees: trees.length > 0 };
  const visible = questionList(answers, flow);
  const index = visible.indexOf(step as (typeof visible)[number]);
  const busy = snap.matches('evaluating');
  const saving = snap.matches('saving');
  const reason = busy ? null : disabledReason(step, answers);
  const isFirst = step === firstStep(answers, flow);
  const tree = trees.find((t) => t.id === treeId);

  // A new step starts at the top with focus on its heading; the answer focuses its headline.
  const heading = useRef<HTMLHeadingElement>(null);
  const mounted = useRef(false);
  useEffect(() => {
    if (!mounted.current) {
      mounted.current = true;
      return;
    }
    window.scrollTo({ top: 0 });
    if (step === 'answer') document.getElementById('answer-headline')?.focus();
    else heading.current?.focus();
  }, [step, offering, result]);

  // After saving, focus goes to what happened: the confirmation (or the error beside the button).
  const saveBox = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (!saved && !snap.context.saveError) return;
    saveBox.current?.querySelector<HTMLElement>('[data-testid="saved"], [role="alert"]')?.focus();
  }, [saved, snap.context.saveError]);

  const nameOf = (slug: string) => species.find((s) => s.slug === slug)?.commonNames[0];
  const startOver = (
    <button type="button" className="btn-secondary shrink-0" data-testid="start-over" onClick={() => send({ type: 'RESTART' })}>
      Start over
    </button>
  );

  if (offering && snap.context.resume) {
    return (
      <div className="mx-auto max-w-xl">
        <section className="card space-y-4" aria-labelledby="resume-h" data-testid="resume-offer">
          <h2 id="resume-h" ref={heading} tabIndex={-1} className="text-xl">
            {resumeQuestion(snap.context.resume, nameOf, Intl.DateTimeFormat().resolvedOptions().timeZone)}
          </h2>
          <p className="text-stone-700">You started these questions earlier and did not finish.</p>
          <div className="flex flex-wrap gap-3">
            <button type="button" className="btn-primary" data-testid="resume-continue" onClick={() => send({ type: 'CONTINUE' })}>
              Continue
            </button>
            <button type="button" className="btn-secondary" data-testid="resume-fresh" onClick={() => send({ type: 'RESTART' })}>
              Start a new question
            </button>
          </div>
        </section>
      </div>
    );
  }

  const doneHref = tree ? `/trees/${tree.id}` : signedIn ? '/answers' : '/';

  return (
    <div className="mx-auto max-w-xl pb-40">
      {step !== 'answer' && (
        <div className="mb-3 flex items-center justify-between gap-3">
          <h2 ref={heading} tabIndex={-1} className="font-sans text-base font-medium text-stone-700" data-testid="ask-progress">
            Question {index + 1} of {visible.length} · {stepTitles[step]}
            {tree && (
              <>
                {' '}
                · for <strong>{tree.name}</strong>
              </>
            )}
          </h2>
          {startOver}
        </div>
      )}
      {error && (
        <p role="alert" className="mb-4 rounded-lg bg-clay-100 p-3 text-clay-700">
          {error}
        </p>
      )}

      <div data-testid={`ask-step-${step}`}>
        {step === 'tree' && <TreeStep trees={trees} value={answers.tree} onPick={(id) => send({ type: 'PICK_TREE', treeId: id })} />}
        {step === 'species' && <SpeciesStep species={species} value={answers.species} onChange={set} />}
        {step === 'health' && <HealthStep answers={answers} onChange={set} />}
        {step === 'shoot' && <ShootStep value={answers.shoot} onChange={set} />}
        {step === 'branching' && <BranchingStep answers={answers} onChange={set} />}
        {step === 'position' && <PositionStep value={answers.position} onChange={set} />}
        {step === 'when' && <WhenStep answers={answers} club={club} onChange={set} />}
        {step === 'answer' && busy && (
          <p className="text-lg" aria-live="polite">
            Working out the answer…
          </p>
        )}
        {step === 'answer' && result && !busy && (
          <div className="space-y-4">
            <WorkedOutOnPhone result={result} />
            <AnswerResult
              result={result}
              actions={
                <div ref={saveBox} className="space-y-3" data-testid="answer-actions">
                  <SaveAnswer
                    signedIn={signedIn}
                    saving={saving}
                    saved={saved}
                    error={snap.context.saveError}
                    onSave={(note, visibility) => send({ type: 'SAVE', note, visibility })}
                  />
                  <div className="flex flex-wrap gap-3">
                    <Link href={doneHref} className="btn-secondary flex-1" data-testid="ask-done" onClick={forget}>
                      Done
                    </Link>
                    <button type="button" className="btn-secondary flex-1" onClick={() => send({ type: 'BACK' })}>
                      Change my answers
                    </button>
                  </div>
                </div>
              }
              after={
                <details className="card" data-testid="calculator-section">
                  <summary className="min-h-target cursor-pointer py-2 font-display text-lg text-moss-900">Liquid feed calculator</summary>
                  <div className="mt-3">
                    <LiquidFeedCalculator />
                  </div>
                </details>
              }
            />
            <div className="flex flex-wrap gap-3">
              <button type="button" className="btn-secondary" onClick={() => send({ type: 'RESTART' })}>
                Ask about another shoot
              </button>
              {signedIn && (
                <Link href="/answers" className="btn-secondary">
                  My answers
                </Link>
              )}
            </div>
          </div>
        )}
      </div>

      {step !== 'answer' && (
        <nav aria-label="Wizard steps" className="fixed inset-x-0 bottom-0 z-10 border-t border-stone-200 bg-white/95 p-3 backdrop-blur">
          <div className="mx-auto max-w-xl">
            {reason && (
              <p id="next-reason" className="mb-2 text-sm font-medium text-stone-800" data-testid="next-reason">
                {reason}
              </p>
            )}
            <div className="flex gap-3">
              <button type="button" className="btn-secondary flex-1 text-lg" onClick={() => send({ type: 'BACK' })} disabled={isFirst}>
                Back
              </button>
              <button
                type="button"
                className="btn-primary flex-[2] text-lg"
                data-testid="ask-next"
                onClick={() => send({ type: 'NEXT' })}
                disabled={!!reason || busy}
                aria-describedby={reason ? 'next-reason' : undefined}
              >
                {step === 'when' ? 'Show the answer' : 'Next'}
              </button>
            </div>
          </div>
        </nav>
      )}
    </div>
  );
}
