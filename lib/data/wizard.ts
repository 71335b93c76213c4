import 'server-only';
import { and, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { trees } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { evaluate, WizardInputError } from '@/lib/wizard/engine';
import type { WizardContext, WizardInput, WizardResult } from '@/lib/wizard/types';
import type { WizardSpecies } from '@/lib/validation/species';
import { getWizardSpecies, listPublishedWizardSpecies } from './species';
import { getClubSettings } from './settings';

export function todayIso(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

async function wizardContext(): Promise<WizardContext> {
  const s = await getClubSettings();
  return { hemisphere: s.hemisphere, latitude: s.defaultLatitude, today: todayIso(), decandleOffsetDays: s.decandleOffsetDays };
}

export interface OfflineWizardData {
  /** The club's settings the engine reads; `today` is left to the phone's own clock. */
  context: Omit<WizardContext, 'today'>;
  species: WizardSpecies[];
}

/** What a phone needs to run the same engine with no signal: every published species and the club's settings. */
export async function offlineWizardData(): Promise<OfflineWizardData> {
  const [s, species] = await Promise.all([getClubSettings(), listPublishedWizardSpecies()]);
  return { context: { hemisphere: s.hemisphere, latitude: s.defaultLatitude, decandleOffsetDays: s.decandleOffsetDays }, species };
}

/** Run the engine on a validated body against the published species. Unknown species → 404. */
export async function runWizard(input: WizardInput): Promise<{ result: WizardResult; species: WizardSpecies }> {
  const species = await getWizardSpecies(input.species);
  if (!species) throw new AppError('not_found:species', 'We have no published species with that name.', { species: ['Unknown species'] });
  try {
    return { result: evaluate(input, species, await wizardContext()), species };
  } catch (e) {
    if (e instanceof WizardInputError) throw new AppError('bad_request:fields', e.message, e.fields);
    throw e;
  }
}

export interface TreePrefill {
  id: string;
  name: string;
  speciesSlug: string;
  container?: { shape: 'round' | 'rectangle' | 'oval'; lengthCm: number; widthCm?: number };
  recentlyCollected: boolean;
}

/** A tree's facts for the wizard, only for its owner; collected counts as recent within two years. */
export async function getTreePrefill(treeId: string, viewer: { id: string } | null, today = todayIso()): Promise<TreePrefill | null> {
  if (!viewer || !/^[A-Za-z0-9_-]{1,64}$/.test(treeId)) return null;
  const db = await getDb();
  const [t] = await db
    .select({
      id: trees.id,
      name: trees.name,
      speciesSlug: trees.speciesSlug,
      shape: trees.containerShape,
      lengthCm: trees.containerLengthCm,
      widthCm: trees.containerWidthCm,
      collectedFromWild: trees.collectedFromWild,
      collectedOn: trees.collectedOn,
    })
    .from(trees)
    .where(and(eq(trees.id, treeId), eq(trees.ownerId, viewer.id)))
    .limit(1);
  if (!t) return null;
  const twoYearsAgo = `${Number(today.slice(0, 4)) - 2}${today.slice(4)}`;
  return {
    id: t.id,
    name: t.name,
    speciesSlug: t.speciesSlug,
    container: t.shape && t.lengthCm ? { shape: t.shape, lengthCm: t.lengthCm, ...(t.widthCm ? { widthCm: t.widthCm } : {}) } : undefined,
    recentlyCollected: t.collectedFromWild && (!t.collectedOn || t.collectedOn >= twoYearsAgo),
  };
}
