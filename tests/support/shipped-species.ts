import { readSpeciesDir } from '@/lib/species/content-dir';
import { toWizardSpecies, type WizardSpecies } from '@/lib/validation/species';

// The species files Candlewise ships (content/species), as the wizard sees them. Engine tests run
// on these, not on fixtures, so a change to a shipped file is a change the tests see.
const all = new Map<string, WizardSpecies>();
for (const f of readSpeciesDir()) {
  if (!f.result.ok) throw new Error(`${f.file}: ${f.result.message}`);
  all.set(f.result.record.slug, toWizardSpecies(f.result.record, 1));
}

export const shippedSpecies = [...all.values()];

export function shipped(slug: string): WizardSpecies {
  const s = all.get(slug);
  if (!s) throw new Error(`no shipped species ${slug}`);
  return s;
}
