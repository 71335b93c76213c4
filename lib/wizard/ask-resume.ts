import type { AskAnswers, AskStep } from './ask-steps';

// An unfinished run kept on the phone, and when to offer it back. Pure: the page reads and writes storage.

export interface StoredRun {
  answers: AskAnswers;
  treeId?: string;
  step?: AskStep;
  /** ISO timestamp of the last change. */
  updatedAt: string;
}

/** A run is worth offering back once it names a species. */
export function isUnfinished(run: StoredRun | null | undefined): run is StoredRun {
  return !!run && typeof run.answers === 'object' && run.answers !== null && typeof run.answers.species === 'string' && typeof run.updatedAt === 'string';
}

export type BootPlan = 'fresh' | 'resume' | 'offer';

/**
 * Every start from a link (the header, the home page, a tree page) is fresh. Coming back to /ask
 * without one offers the unfinished run; a reload inside a run (the URL names a step) carries on.
 */
export function bootPlan({ stored, freshIntent, stepInUrl }: { stored: StoredRun | null; freshIntent: boolean; stepInUrl: boolean }): BootPlan {
  if (freshIntent || !isUnfinished(stored)) return 'fresh';
  return stepInUrl ? 'resume' : 'offer';
}

/** Query parameters that mean "start a new run": an explicit start, or a tree, species or pot to fill in. */
export const freshParams = ['start', 'tree', 'species', 'shape', 'lengthCm', 'widthCm', 'collected'] as const;

/** "Continue with Scots pine, 15 May?" */
export function resumeQuestion(run: StoredRun, speciesName: (slug: string) => string | undefined, timeZone = 'UTC'): string {
  const name = speciesName(run.answers.species ?? '') ?? 'your last tree';
  const day = new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'long', timeZone }).format(new Date(run.updatedAt));
  return `Continue with ${name}, ${day}?`;
}
