import type { Metadata } from 'next';
import { Suspense } from 'react';
import { getCurrentUser } from '@/lib/auth/session';
import { listWizardSpeciesNames } from '@/lib/data/species';
import { getClubSettings } from '@/lib/data/settings';
import { getTreePrefill, todayIso } from '@/lib/data/wizard';
import type { AskAnswers } from '@/lib/wizard/ask.machine';
import { containerShapes, type ContainerShape } from '@/lib/wizard/types';
import { AskWizard } from './_components/ask-wizard';

export const metadata: Metadata = { title: 'Ask about a shoot' };

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);
const cm = (v: string | undefined) => {
  const n = v === undefined ? NaN : Number(v);
  return Number.isFinite(n) && n > 0 && n <= 300 ? n : undefined;
};

/** Pre-fill from a link: ?species=&shape=&lengthCm=&widthCm=&collected=1 (no tree needed). */
function prefillFromQuery(q: Search, known: Set<string>): AskAnswers {
  const out: AskAnswers = {};
  const species = one(q.species);
  if (species && known.has(species)) out.species = species;
  const shape = one(q.shape) as ContainerShape | undefined;
  const lengthCm = cm(one(q.lengthCm));
  const widthCm = cm(one(q.widthCm));
  if (shape && containerShapes.includes(shape) && lengthCm) out.container = { shape, lengthCm, ...(shape !== 'round' && widthCm ? { widthCm } : {}) };
  if (one(q.collected) === '1') out.recentlyCollected = true;
  return out;
}

export default async function AskPage({ searchParams }: { searchParams: Promise<Search> }) {
  const q = await searchParams;
  const [user, species, club] = await Promise.all([getCurrentUser(), listWizardSpeciesNames(), getClubSettings()]);
  const known = new Set(species.map((s) => s.slug));
  let prefill = prefillFromQuery(q, known);
  const treeParam = one(q.tree);
  const tree = treeParam ? await getTreePrefill(treeParam, user) : null;
  if (tree) {
    prefill = {
      ...prefill,
      ...(known.has(tree.speciesSlug) ? { species: tree.speciesSlug } : {}),
      ...(tree.container ? { container: tree.container } : {}),
      ...(tree.recentlyCollected ? { recentlyCollected: true } : {}),
    };
  }
  return (
    <div className="space-y-4">
      <div className="mx-auto max-w-xl">
        <h1 className="page-title">Ask about a shoot</h1>
        <p className="text-stone-700">A few questions about one shoot, then one clear thing to do, with the reasons.</p>
        {treeParam && !tree && <p role="status" className="mt-2 rounded-lg bg-sun-100 p-3">That tree is not among yours, so nothing was filled in.</p>}
      </div>
      <Suspense fallback={<p className="text-stone-700">Loading the questions…</p>}>
        <AskWizard
          species={species}
          prefill={prefill}
          treeId={tree?.id}
          treeName={tree?.name}
          club={{ hemisphere: club.hemisphere, latitude: club.defaultLatitude, name: club.clubName }}
          today={todayIso()}
          signedIn={!!user}
        />
      </Suspense>
    </div>
  );
}
