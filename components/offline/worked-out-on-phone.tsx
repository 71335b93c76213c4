'use client';
import type { WizardResult } from '@/lib/wizard/types';
import { isWorkedOutOnPhone } from './evaluate-anywhere';

/** Says when an answer came from this phone's own copy of the rules, and which copy. */
export function WorkedOutOnPhone({ result }: { result: WizardResult }) {
  if (!isWorkedOutOnPhone(result)) return null;
  return (
    <p role="status" className="rounded-lg border-2 border-sun-500 bg-sun-100 p-3 text-stone-900" data-testid="worked-out-on-phone">
      <strong>Worked out on this phone</strong> with no connection, using rules version {result.engineVersion} and species revision {result.speciesRevision}.
      When you save, Candlewise works it out again and shows both if they differ.
    </p>
  );
}
