import type { PhoneResult } from '@/lib/validation/offline';
import type { WizardResult } from '@/lib/wizard/types';

/**
 * When the phone worked an answer out offline and the server, re-evaluating on save, came to
 * something else: both, side by side, with the rules and species revision each used.
 */
export function PhoneComparison({ phone, server }: { phone: PhoneResult; server: WizardResult }) {
  const serverRules = new Set(server.reasons.map((r) => r.rule));
  const phoneRules = new Set(phone.reasons.map((r) => r.rule));
  const onlyPhone = phone.reasons.filter((r) => !serverRules.has(r.rule));
  const onlyServer = server.reasons.filter((r) => !phoneRules.has(r.rule));
  return (
    <section className="card border-2 border-sun-500" aria-labelledby="phone-diff-h" data-testid="phone-comparison">
      <h2 id="phone-diff-h" className="text-lg">
        The phone and Candlewise came to different answers
      </h2>
      <p className="text-stone-700">
        This answer was worked out on a phone with no connection. When it was saved, Candlewise worked it out again with the rules and species data it holds
        now. The saved answer above is Candlewise&rsquo;s; the phone&rsquo;s is kept here.
      </p>
      <dl className="mt-3 grid gap-3 sm:grid-cols-2">
        <div className="rounded-lg bg-sun-100 p-3" data-testid="phone-answer">
          <dt className="font-semibold">On the phone</dt>
          <dd className="mt-1">{phone.headline}</dd>
          <dd className="mt-1 text-sm text-stone-700">
            Rules version {phone.engineVersion}, species revision {phone.speciesRevision}
          </dd>
        </div>
        <div className="rounded-lg bg-moss-50 p-3" data-testid="server-answer">
          <dt className="font-semibold">Saved by Candlewise</dt>
          <dd className="mt-1">{server.headline}</dd>
          <dd className="mt-1 text-sm text-stone-700">
            Rules version {server.engineVersion}, species revision {server.speciesRevision}
          </dd>
        </div>
      </dl>
      {(onlyPhone.length > 0 || onlyServer.length > 0) && (
        <details className="mt-3">
          <summary className="min-h-target cursor-pointer py-2 font-medium">Which reasons differ</summary>
          {onlyPhone.length > 0 && (
            <>
              <p className="mt-2 font-medium">Only on the phone</p>
              <ul className="list-disc pl-5">
                {onlyPhone.map((r) => (
                  <li key={r.rule}>{r.text}</li>
                ))}
              </ul>
            </>
          )}
          {onlyServer.length > 0 && (
            <>
              <p className="mt-2 font-medium">Only in the saved answer</p>
              <ul className="list-disc pl-5">
                {onlyServer.map((r) => (
                  <li key={r.rule}>{r.text}</li>
                ))}
              </ul>
            </>
          )}
        </details>
      )}
    </section>
  );
}
