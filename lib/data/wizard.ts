import 'server-only';
import { AppError } from '@/lib/errors';
import { evaluate, WizardInputError } from '@/lib/wizard/engine';
import type { WizardContext, WizardInput, WizardResult } from '@/lib/wizard/types';
import type { WizardSpecies } from '@/lib/validation/species';
import { getWizardSpecies } from './species';
import { getClubSettings } from './settings';

export function todayIso(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

export async function wizardContext(): Promise<WizardContext> {
  const s = await getClubSettings();
  return { hemisphere: s.hemisphere, latitude: s.defaultLatitude, today: todayIso() };
}

/** Run the engine on a validated body against the published species. Unknown species → 404. */
export async function runWizard(input: WizardInput): Promise<{ result: WizardResult; species: WizardSpecies }> {
  const species = await getWizardSpecies(input.species);
  if (!species) throw new AppError('not_found:species', 'We have no published species with that name.', { species: ['Unknown species'] });
  try {
    return { result: evaluate(input, species, await wizardContext()), species };
  } catch (e) {
    if (e instanceof WizardInputError) throw new AppError('bad_request:fields', e.message, { [e.field]: [e.message] });
    throw e;
  }
}
