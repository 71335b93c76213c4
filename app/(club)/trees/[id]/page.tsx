import type { Metadata } from 'next';
import Link from 'next/link';
import { requirePageUser } from '@/lib/auth/page-guard';
import { listTreeAnswers } from '@/lib/data/trees';
import { askParamsFor, describeCollected, describeContainer } from '@/lib/trees/describe';
import { todayIso } from '@/lib/validation/trees';
import { loadTreeOr404 } from '../_components/load-tree';
import { DeleteTreeButton } from '../_components/delete-tree-button';
import { listPhotos } from '@/lib/data/photos';
import { PhotoPanel } from '@/components/photos/photo-panel';
import { getTreePlan } from '@/lib/data/plan';
import { SeasonTimeline } from '../_components/season-timeline';
import { stageFor } from '@/lib/data/tree-due-now';

export const metadata: Metadata = { title: 'Tree' };

const actionLabels: Record<string, string> = {
  pinch: 'Pinch',
  prune: 'Prune',
  'let-grow': 'Let grow',
  decandle: 'Decandle',
  wait: 'Wait',
};

export default async function TreePage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const actor = await requirePageUser(`/trees/${encodeURIComponent(id)}`);
  const tree = await loadTreeOr404(actor, id);
  const [answers, photos] = await Promise.all([listTreeAnswers(actor, tree.id), listPhotos(actor, { treeId: tree.id })]);
  const latest = answers.length ? answers[answers.length - 1].stage : null;
  const plan = await getTreePlan(actor, tree.id);
  const { stage: knownStage, basis: stageBasis } = stageFor(tree, latest, todayIso());
  const stage = knownStage ?? 'refinement';
  const ask = `/ask?${askParamsFor(tree, todayIso()).toString()}`;

  return (
    <div className="space-y-8">
      <p>
        <Link href="/trees">← Your trees</Link>
      </p>
      <header className="space-y-2">
        <h1 className="page-title" data-testid="tree-name">
          {tree.name}
        </h1>
        <p className="text-lg text-stone-700">{tree.speciesName ? <Link href={`/species/${tree.speciesSlug}`}>{tree.speciesName}</Link> : tree.speciesSlug}</p>
        <div className="flex flex-wrap gap-3 pt-2">
          <Link href={ask} className="btn-primary" data-testid="ask-about-tree">
            Ask about this tree
          </Link>
          <Link href={`/trees/${tree.id}/edit`} className="btn-secondary">
            Edit
          </Link>
          <DeleteTreeButton id={tree.id} name={tree.name} />
        </div>
      </header>

      {plan ? <SeasonTimeline plan={plan} stage={stage} stageBasis={stageBasis} /> : null}

      <section aria-labelledby="facts" className="card">
        <h2 id="facts" className="mb-3 text-xl">
          About this tree
        </h2>
        <dl className="grid gap-x-6 gap-y-3 sm:grid-cols-2">
          <div>
            <dt className="text-sm font-medium text-stone-600">Container</dt>
            <dd>{describeContainer(tree)}</dd>
          </div>
          <div>
            <dt className="text-sm font-medium text-stone-600">Acquired</dt>
            <dd>{tree.acquiredOn ?? 'Not given'}</dd>
          </div>
          <div>
            <dt className="text-sm font-medium text-stone-600">Collected from the wild</dt>
            <dd>{describeCollected(tree)}</dd>
          </div>
          <div className="sm:col-span-2">
            <dt className="text-sm font-medium text-stone-600">Stage notes</dt>
            <dd className="whitespace-pre-wrap">{tree.stageNotes || '—'}</dd>
          </div>
          <div className="sm:col-span-2">
            <dt className="text-sm font-medium text-stone-600">Notes</dt>
            <dd className="whitespace-pre-wrap">{tree.notes || '—'}</dd>
          </div>
        </dl>
      </section>

      <section aria-labelledby="photos" className="space-y-3">
        <h2 id="photos" className="text-xl">
          Photos
        </h2>
        <PhotoPanel target={{ treeId: tree.id }} initial={photos} canAdd label={tree.name} />
      </section>

      <section aria-labelledby="answers-over-time" className="space-y-3">
        <h2 id="answers-over-time" className="text-xl">
          Answers over time
        </h2>
        {answers.length === 0 ? (
          <p className="card text-stone-700">No answers about this tree yet. Use “Ask about this tree” at the next candle check.</p>
        ) : (
          <ol className="space-y-2 border-l-2 border-moss-300 pl-4" data-testid="tree-answers">
            {answers.map((a) => (
              <li key={a.id} className="card py-3">
                <Link href={`/answers/${a.id}`} className="font-medium">
                  <time dateTime={a.observedOn}>{a.observedOn}</time>: {actionLabels[a.action] ?? a.action}
                </Link>
                <span className="ml-2 text-sm text-stone-600">
                  {a.stage}, {a.season}
                  {a.visibility === 'club' ? ' · shared with the club' : ''}
                </span>
                {a.followUp ? <p className="mt-1 text-sm text-stone-700">What happened: {a.followUp}</p> : null}
              </li>
            ))}
          </ol>
        )}
      </section>
    </div>
  );
}
