import { RULES } from './rules';
import type { Reason, WizardResult } from './types';

// Re-running a stored answer: what differs between the stored result and today's, and why.

interface FieldChange {
  field: string;
  label: string;
  before: unknown;
  after: unknown;
}

export interface ResultComparison {
  same: boolean;
  engineChanged: { before: string; after: string } | null;
  speciesChanged: { before: number; after: number } | null;
  changes: FieldChange[];
  rulesAdded: Reason[];
  rulesRemoved: Reason[];
  /** Rules that fired both times but whose wording or source changed. */
  rulesReworded: { rule: string; before: Reason; after: Reason }[];
  why: string[];
}

// Stored answers from engine 1.0.0 lack the v2 fields (candleKeep, keepNeedleBundles, howTo): they
// read as null, so a re-run shows them as added.
type Stored = Pick<WizardResult, 'action' | 'stage' | 'season' | 'keepNeedlePairs' | 'reasons' | 'fertilizer' | 'engineVersion' | 'speciesRevision'> &
  Partial<Pick<WizardResult, 'candleKeep' | 'keepNeedleBundles' | 'howTo'>>;

const fields: { field: string; label: string; get: (r: Stored) => unknown }[] = [
  { field: 'action', label: 'Action', get: (r) => r.action },
  { field: 'stage', label: 'Stage', get: (r) => r.stage },
  { field: 'season', label: 'Season', get: (r) => r.season },
  { field: 'keepNeedlePairs', label: 'Needle pairs to keep', get: (r) => r.keepNeedlePairs },
  { field: 'candleKeep', label: 'Share of the candle to keep', get: (r) => r.candleKeep ?? null },
  { field: 'keepNeedleBundles', label: 'Needle bundles to keep', get: (r) => r.keepNeedleBundles ?? null },
  { field: 'howTo', label: 'How to do it', get: (r) => r.howTo ?? null },
  { field: 'fertilizer.feedNow', label: 'Feed now', get: (r) => r.fertilizer?.feedNow },
  { field: 'fertilizer.piles', label: 'Piles of pellets', get: (r) => r.fertilizer?.piles },
  { field: 'fertilizer.pelletsPerPile', label: 'Pellets per pile', get: (r) => r.fertilizer?.pelletsPerPile },
  { field: 'fertilizer.foliar', label: 'Foliar feed', get: (r) => r.fertilizer?.foliar },
  { field: 'fertilizer.window', label: 'Feeding window', get: (r) => r.fertilizer?.window },
];

// Stored results come back from jsonb with their keys reordered: compare canonically.
function canonical(v: unknown): unknown {
  if (Array.isArray(v)) return v.map(canonical);
  if (v && typeof v === 'object') {
    return Object.fromEntries(
      Object.keys(v as object)
        .sort()
        .map((k) => [k, canonical((v as Record<string, unknown>)[k])]),
    );
  }
  return v ?? null;
}
const same = (a: unknown, b: unknown) => JSON.stringify(canonical(a)) === JSON.stringify(canonical(b));

export function compareResults(before: Stored, after: Stored): ResultComparison {
  const changes = fields
    .map((f) => ({ field: f.field, label: f.label, before: f.get(before) ?? null, after: f.get(after) ?? null }))
    .filter((c) => !same(c.before, c.after));
  const beforeRules = new Map(before.reasons.map((r) => [r.rule, r]));
  const afterRules = new Map(after.reasons.map((r) => [r.rule, r]));
  const rulesAdded = after.reasons.filter((r) => !beforeRules.has(r.rule));
  const rulesRemoved = before.reasons.filter((r) => !afterRules.has(r.rule));
  const rulesReworded = after.reasons
    .filter((r) => beforeRules.has(r.rule) && !same(beforeRules.get(r.rule), r))
    .map((r) => ({ rule: r.rule, before: beforeRules.get(r.rule)!, after: r }));
  const engineChanged = before.engineVersion !== after.engineVersion ? { before: before.engineVersion, after: after.engineVersion } : null;
  const speciesChanged = before.speciesRevision !== after.speciesRevision ? { before: before.speciesRevision, after: after.speciesRevision } : null;

  const why: string[] = [];
  if (engineChanged) why.push(`The rule set changed from version ${engineChanged.before} to ${engineChanged.after}.`);
  if (speciesChanged) why.push(`The species record changed from revision ${speciesChanged.before} to ${speciesChanged.after}.`);
  for (const r of rulesAdded) why.push(`Now applies: ${r.text}`);
  for (const r of rulesRemoved) {
    const gone = !(r.rule in RULES);
    why.push(gone ? `The rule “${r.rule}” no longer exists.` : `No longer applies: ${r.text}`);
  }
  if (!why.length && !changes.length) why.push('Nothing changed: today’s rules and species data give the same answer.');

  return {
    same: !changes.length && !rulesAdded.length && !rulesRemoved.length && !rulesReworded.length,
    engineChanged,
    speciesChanged,
    changes,
    rulesAdded,
    rulesRemoved,
    rulesReworded,
    why,
  };
}
