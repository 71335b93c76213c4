import type { ReactNode } from 'react';
import type { WizardResult } from '@/lib/wizard/types';
import { candleKeepText } from '@/lib/wizard/candle-keep';
import { TermExplanation, TermText } from './term-text';

const capitalise = (t: string) => t.charAt(0).toUpperCase() + t.slice(1);

// The answer, shown the same way in the wizard and on a saved answer's page. On a phone the action,
// what to keep and the page's own buttons (`actions`) come first; everything else follows in
// sections that open with one tap.

const stageLabel = { development: 'Development', refinement: 'Refinement', recovery: 'Recovery' } as const;
const seasonLabel = { winter: 'Winter', spring: 'Spring', summer: 'Summer', autumn: 'Autumn' } as const;
const actionTone: Record<WizardResult['action'], string> = {
  pinch: 'bg-moss-700',
  prune: 'bg-bark-700',
  decandle: 'bg-bark-800',
  'let-grow': 'bg-moss-600',
  thin: 'bg-moss-800',
  wait: 'bg-stone-700',
};

function Section({
  title,
  testId,
  open,
  tone = 'card',
  children,
  count,
}: {
  title: string;
  testId: string;
  open?: boolean;
  tone?: 'card' | 'caution';
  children: ReactNode;
  count?: number;
}) {
  const box = tone === 'caution' ? 'rounded-card border-2 border-sun-500 bg-sun-100 p-4 sm:p-6' : 'card';
  return (
    <details className={`group ${box}`} data-testid={testId} open={open}>
      <summary
        className={`flex min-h-target cursor-pointer list-none items-center gap-2 font-display text-lg [&::-webkit-details-marker]:hidden ${tone === 'caution' ? 'text-sun-700' : 'text-moss-900'}`}
      >
        {title}
        {count ? <span className="font-sans text-sm text-stone-700">({count})</span> : null}
        <span aria-hidden="true" className="ml-auto font-sans text-sm text-moss-700 group-open:hidden">
          Show ▾
        </span>
        <span aria-hidden="true" className="ml-auto hidden font-sans text-sm text-moss-700 group-open:inline">
          Hide ▴
        </span>
      </summary>
      <div className="mt-2">{children}</div>
    </details>
  );
}

export function AnswerResult({ result, actions, after }: { result: WizardResult; actions?: ReactNode; after?: ReactNode }) {
  const f = result.fertilizer;
  const terms = result.terms;
  const headline = result.action === 'pinch' || result.action === 'prune' ? result.headline.split(':')[0] : result.headline;
  return (
    <div className="space-y-4">
      <section className={`rounded-card p-4 text-white sm:p-5 ${actionTone[result.action]}`} data-testid="answer-action" aria-labelledby="answer-headline">
        <p className="text-sm uppercase tracking-wide text-white/85">
          {result.speciesName} · {stageLabel[result.stage]} · {seasonLabel[result.season]}
        </p>
        <h2 id="answer-headline" tabIndex={-1} className="mt-1 font-display text-2xl font-semibold text-white sm:text-4xl">
          <TermText text={headline} terms={terms} />
        </h2>
        {result.candleKeep ? (
          <p className="mt-3 rounded-lg bg-white/15 p-3 text-lg font-semibold" data-testid="keep-candle">
            <TermText text={capitalise(candleKeepText(result.candleKeep))} terms={terms} />
          </p>
        ) : null}
        {result.keepNeedleBundles != null ? (
          <p className="mt-3 rounded-lg bg-white/15 p-3 text-lg font-semibold" data-testid="keep-needles">
            <TermText
              text={`Leave at least ${result.keepNeedleBundles} ${result.keepNeedlePairs != null ? 'needle pairs' : 'needle bundles'} below the cut`}
              terms={terms}
            />
          </p>
        ) : result.keepNeedlePairs != null && result.candleKeep === undefined ? (
          // Answers saved by engine 1.0.0 carry only the pair count.
          <p className="mt-3 rounded-lg bg-white/15 p-3 text-lg font-semibold" data-testid="keep-needles">
            Leave at least {result.keepNeedlePairs} pairs of needles
          </p>
        ) : null}
        <p className="mt-3 text-white/90" data-testid="day-length">
          {result.date} · {result.dayLength.text}
        </p>
      </section>

      {actions}

      {result.howTo?.length ? (
        <Section title="How to do it" testId="how-to" open>
          <ol className="list-decimal space-y-1 pl-5">
            {result.howTo.map((s) => (
              <li key={s}>
                <TermText text={s} terms={terms} />
              </li>
            ))}
          </ol>
        </Section>
      ) : null}

      {result.watch.length > 0 && (
        <Section title="What to watch for next" testId="watch">
          <ul className="list-disc space-y-1 pl-5">
            {result.watch.map((w) => (
              <li key={w}>
                <TermText text={w} terms={terms} />
              </li>
            ))}
          </ul>
        </Section>
      )}

      <Section title="Why" testId="why">
        <ol className="space-y-3" data-testid="reasons">
          {result.reasons.map((r) => (
            <li key={r.rule} className="border-l-4 border-moss-300 pl-3">
              <p>
                <TermText text={r.text} terms={terms} />
              </p>
              <p className="text-sm text-stone-700">Source: {r.source}</p>
            </li>
          ))}
        </ol>
        <details className="mt-3" data-testid="rule-details">
          <summary className="min-h-target cursor-pointer py-2.5 text-sm font-medium text-moss-700">Details for checking</summary>
          <p className="text-sm text-stone-700">
            Rules applied, in order:{' '}
            {result.reasons.map((r, i) => (
              <span key={r.rule}>
                {i ? ', ' : ''}
                <code>{r.rule}</code>
              </span>
            ))}
            . Engine {result.engineVersion}, species revision {result.speciesRevision}.
          </p>
        </details>
      </Section>

      <Section title="Take care" testId="cautions" tone="caution" count={result.cautions.length}>
        <ul className="list-disc space-y-2 pl-5 text-stone-900">
          {result.cautions.map((c) => (
            <li key={c.text}>
              {c.text} <span className="text-sm text-stone-700">({c.source})</span>
            </li>
          ))}
        </ul>
      </Section>

      <Section title="Feeding" testId="feeding">
        <p className="font-medium">{f.purpose}</p>
        <p
          className={`mt-2 inline-block rounded-lg px-3 py-1 font-semibold ${f.feedNow ? 'bg-moss-100 text-moss-800' : 'bg-stone-200 text-stone-800'}`}
          data-testid="feed-now"
        >
          {f.feedNow ? 'Feed now' : 'Do not feed now'}
        </p>
        <dl className="mt-3 grid gap-2 sm:grid-cols-[12rem_1fr]">
          <dt className="font-medium text-stone-700">When</dt>
          <dd>{f.window}</dd>
          <dt className="font-medium text-stone-700">Organic pellets</dt>
          <dd data-testid="feed-placement">{f.placement}</dd>
          {f.surfaceCm2 !== null && (
            <>
              <dt className="font-medium text-stone-700">Soil surface</dt>
              <dd>about {f.surfaceCm2} cm²</dd>
            </>
          )}
          {f.pelletSize ? (
            <>
              <dt className="font-medium text-stone-700">Pellet size</dt>
              <dd>{f.pelletSize}</dd>
            </>
          ) : null}
          {f.renewWeeks ? (
            <>
              <dt className="font-medium text-stone-700">Renew piles</dt>
              <dd>
                every {f.renewWeeks.min}–{f.renewWeeks.max} weeks, as they crumble away
              </dd>
            </>
          ) : null}
          {!f.feedNow && f.resumeWhen ? (
            <>
              <dt className="font-medium text-stone-700">Start again</dt>
              <dd>{f.resumeWhen}</dd>
            </>
          ) : null}
          <dt className="font-medium text-stone-700">Foliar feed</dt>
          <dd>{f.foliar ? 'Yes: fish emulsion or kelp, as the label directs' : 'No'}</dd>
        </dl>
        <details className="mt-3">
          <summary className="min-h-target cursor-pointer py-2.5 font-medium text-moss-700">Why this plan</summary>
          <ul className="mt-2 space-y-2">
            {f.reasons.map((r) => (
              <li key={r.rule}>
                {r.text} <span className="text-sm text-stone-700">({r.source})</span>
              </li>
            ))}
          </ul>
        </details>
      </Section>

      {terms?.length ? (
        <Section title="Words used here" testId="terms">
          <div className="space-y-1">
            {terms.map((t) => (
              <details key={t.term} className="rounded-lg border border-stone-200 px-3">
                <summary className="min-h-target cursor-pointer py-2.5 font-semibold capitalize">{t.term}</summary>
                <div className="pb-2">
                  <TermExplanation term={t} />
                </div>
              </details>
            ))}
          </div>
        </Section>
      ) : null}

      {after}
    </div>
  );
}
