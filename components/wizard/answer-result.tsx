import type { WizardResult } from '@/lib/wizard/types';
import { candleKeepText } from '@/lib/wizard/candle-keep';

const capitalise = (t: string) => t.charAt(0).toUpperCase() + t.slice(1);

// The answer, shown the same way in the wizard and on a saved answer's page.

const stageLabel = { development: 'Development', refinement: 'Refinement', recovery: 'Recovery' } as const;
const seasonLabel = { winter: 'Winter', spring: 'Spring', summer: 'Summer', autumn: 'Autumn' } as const;
const actionTone: Record<WizardResult['action'], string> = {
  pinch: 'bg-moss-700', prune: 'bg-bark-700', decandle: 'bg-bark-800', 'let-grow': 'bg-moss-600', thin: 'bg-moss-800', wait: 'bg-stone-700',
};

export function AnswerResult({ result }: { result: WizardResult }) {
  const f = result.fertilizer;
  return (
    <div className="space-y-5">
      <section className={`rounded-card p-5 text-white ${actionTone[result.action]}`} data-testid="answer-action" aria-labelledby="answer-headline">
        <p className="text-sm uppercase tracking-wide text-white/85">{result.speciesName} · {stageLabel[result.stage]} · {seasonLabel[result.season]}</p>
        <h2 id="answer-headline" className="mt-1 font-display text-3xl font-semibold text-white sm:text-4xl">{result.action === 'pinch' || result.action === 'prune' ? result.headline.split(':')[0] : result.headline}</h2>
        {result.candleKeep ? (
          <p className="mt-3 rounded-lg bg-white/15 p-3 text-xl font-semibold" data-testid="keep-candle">
            {capitalise(candleKeepText(result.candleKeep))}
          </p>
        ) : null}
        {result.keepNeedleBundles != null ? (
          <p className="mt-3 rounded-lg bg-white/15 p-3 text-xl font-semibold" data-testid="keep-needles">
            Leave at least {result.keepNeedleBundles} {result.keepNeedlePairs != null ? 'needle pairs' : 'needle bundles'} below the cut
          </p>
        ) : result.keepNeedlePairs != null && result.candleKeep === undefined ? (
          // Answers saved by engine 1.0.0 carry only the pair count.
          <p className="mt-3 rounded-lg bg-white/15 p-3 text-xl font-semibold" data-testid="keep-needles">
            Leave at least {result.keepNeedlePairs} pairs of needles
          </p>
        ) : null}
        <p className="mt-3 text-white/90" data-testid="day-length">{result.date} · {result.dayLength.text}</p>
      </section>

      {result.howTo?.length ? (
        <section className="card" aria-labelledby="howto-h" data-testid="how-to">
          <h3 id="howto-h" className="text-lg">How to do it</h3>
          <ol className="mt-2 list-decimal space-y-1 pl-5">{result.howTo.map((s) => <li key={s}>{s}</li>)}</ol>
        </section>
      ) : null}

      {result.terms?.length ? (
        <section className="card" aria-labelledby="terms-h" data-testid="terms">
          <h3 id="terms-h" className="text-lg">Words used here</h3>
          <div className="mt-2 space-y-1">
            {result.terms.map((t) => (
              <details key={t.term} className="rounded-lg border border-stone-200 px-3 py-2">
                <summary className="min-h-11 cursor-pointer py-2 font-semibold">{t.term}</summary>
                <p className="pb-2">{t.definition}</p>
              </details>
            ))}
          </div>
        </section>
      ) : null}

      {result.watch.length > 0 && (
        <section className="card" aria-labelledby="watch-h">
          <h3 id="watch-h" className="text-lg">What to watch for next</h3>
          <ul className="mt-2 list-disc space-y-1 pl-5">{result.watch.map((w) => <li key={w}>{w}</li>)}</ul>
        </section>
      )}

      <section className="card" aria-labelledby="why-h">
        <h3 id="why-h" className="text-lg">Why</h3>
        <ol className="mt-2 space-y-3" data-testid="reasons">
          {result.reasons.map((r) => (
            <li key={r.rule} className="border-l-4 border-moss-300 pl-3">
              <p>{r.text}</p>
              <p className="text-sm text-stone-700">Source: {r.source} · rule <code>{r.rule}</code></p>
            </li>
          ))}
        </ol>
      </section>

      <section className="rounded-card border-2 border-sun-500 bg-sun-100 p-4 sm:p-6" aria-labelledby="caution-h" data-testid="cautions">
        <h3 id="caution-h" className="text-lg text-sun-700">Take care</h3>
        <ul className="mt-2 list-disc space-y-2 pl-5 text-stone-900">
          {result.cautions.map((c) => <li key={c.text}>{c.text} <span className="text-sm text-stone-700">({c.source})</span></li>)}
        </ul>
      </section>

      <section className="card" aria-labelledby="feed-h" data-testid="feeding">
        <h3 id="feed-h" className="text-lg">Feeding</h3>
        <p className="mt-1 font-medium">{f.purpose}</p>
        <p className={`mt-2 inline-block rounded-lg px-3 py-1 font-semibold ${f.feedNow ? 'bg-moss-100 text-moss-800' : 'bg-stone-200 text-stone-800'}`} data-testid="feed-now">
          {f.feedNow ? 'Feed now' : 'Do not feed now'}
        </p>
        <dl className="mt-3 grid gap-2 sm:grid-cols-[12rem_1fr]">
          <dt className="font-medium text-stone-700">When</dt><dd>{f.window}</dd>
          <dt className="font-medium text-stone-700">Organic pellets</dt><dd data-testid="feed-placement">{f.placement}</dd>
          {f.surfaceCm2 !== null && (<><dt className="font-medium text-stone-700">Soil surface</dt><dd>about {f.surfaceCm2} cm²</dd></>)}
          {f.pelletSize ? (<><dt className="font-medium text-stone-700">Pellet size</dt><dd>{f.pelletSize}</dd></>) : null}
          {f.renewWeeks ? (<><dt className="font-medium text-stone-700">Renew piles</dt><dd>every {f.renewWeeks.min}–{f.renewWeeks.max} weeks, as they crumble away</dd></>) : null}
          {!f.feedNow && f.resumeWhen ? (<><dt className="font-medium text-stone-700">Start again</dt><dd>{f.resumeWhen}</dd></>) : null}
          <dt className="font-medium text-stone-700">Foliar feed</dt><dd>{f.foliar ? 'Yes: fish emulsion or kelp, as the label directs' : 'No'}</dd>
        </dl>
        <details className="mt-3">
          <summary className="min-h-target cursor-pointer py-2 font-medium text-moss-700">Why this plan</summary>
          <ul className="mt-2 space-y-2">
            {f.reasons.map((r) => <li key={r.rule}>{r.text} <span className="text-sm text-stone-700">({r.source})</span></li>)}
          </ul>
        </details>
      </section>
    </div>
  );
}
