import type { Metadata } from 'next';
import { Suspense } from 'react';
import { getCurrentUser } from '@/lib/auth/session';
import { listWizardSpeciesNames } from '@/lib/data/species';
import { getClubSettings } from '@/lib/data/settings';
import { listTrees } from '@/lib/data/trees';
import { todayIso } from '@/lib/data/wizard';
import { prefillFromQuery, treeOption } from '@/lib/trees/ask-prefill';
import { answersForTree } from '@/lib/wizard/ask-steps';
import { AskWizard } from './_components/ask-wizard';

export const metadata: Metadata = { title: 'Ask about a shoot' };

type Search = Record<string, string | string[] | undefined>;
const one = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v);

export default async function AskPage({ searchParams }: { searchParams: Promise<Search> }) {
  const q = await searchParams;
  const [user, species, club] = await Promise.all([getCurrentUser(), listWizardSpeciesNames(), getClubSettings()]);
  const known = new Set(species.map((s) => s.slug));
  const today = todayIso();
  const trees = user ? (await listTrees(user)).map((t) => treeOption(t, known, today)) : [];
  let prefill = prefillFromQuery(q, known);
  const treeParam = one(q.tree);
  const tree = treeParam ? trees.find((t) => t.id === treeParam) : undefined;
  if (tree) prefill = answersForTree(prefill, tree);
  return (
    <div className="space-y-4">
      <div className="mx-auto max-w-xl">
        <h1 className="page-title">Ask about a shoot</h1>
        <p className="text-stone-700">A few questions about one shoot, then one clear thing to do, with the reasons.</p>
        {treeParam && !tree && (
          <p role="status" className="mt-2 rounded-lg bg-sun-100 p-3">
            That tree is not among yours, so nothing was filled in.
          </p>
        )}
      </div>
      <Suspense fallback={<p className="text-stone-700">Loading the questions…</p>}>
        <AskWizard
          species={species}
          prefill={prefill}
          trees={trees}
          treeId={tree?.id}
          club={{ hemisphere: club.hemisphere, latitude: club.defaultLatitude, name: club.clubName }}
          today={today}
          signedIn={!!user}
        />
      </Suspense>
    </div>
  );
}
