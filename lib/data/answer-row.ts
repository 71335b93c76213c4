import type { WizardInput, WizardResult } from '@/lib/wizard/types';

/** The columns of an `answers` row that follow from the inputs and the engine's result. */
export function answerRowFromResult(input: WizardInput, result: WizardResult) {
  return {
    speciesSlug: result.speciesSlug,
    speciesRevision: result.speciesRevision,
    engineVersion: result.engineVersion,
    action: result.action,
    stage: result.stage,
    season: result.season,
    observedOn: result.date,
    input,
    result,
  };
}
