import type { Metadata } from 'next';
import Link from 'next/link';
import { notFound } from 'next/navigation';
import { requirePageUser } from '@/lib/auth/page-guard';
import { getAnswer } from '@/lib/data/answers';
import { AnswerResult } from '@/components/wizard/answer-result';
import { OwnerControls } from './_components/owner-controls';
import { RerunPanel } from './_components/rerun-panel';
import { Backlinks } from '@/components/backlinks';
import { PhotoPanel } from '@/components/photos/photo-panel';
import { listPhotos } from '@/lib/data/photos';
import { PhoneComparison } from '@/components/offline/phone-comparison';
import type { PhoneResult } from '@/lib/validation/offline';
import { listTrees } from '@/lib/data/trees';

export const metadata: Metadata = { title: 'Answer' };

const inputLabels: [string, string][] = [
  ['branching', 'Branching'],
  ['shoot', 'Shoot'],
  ['position', 'Against the outline'],
  ['health', 'Health'],
  ['recentlyCollected', 'Recently collected'],
  ['backBuds', 'Back buds'],
  ['hemisphere', 'Hemisphere'],
  ['latitude', 'Latitude'],
];

const valueLabels: Record<string, string> = {
  primary: 'primary only',
  secondary: 'primary and secondary',
  tertiary: 'primary, secondary and tertiary',
  'dormant-bud': 'dormant bud',
  'candle-extending': 'candle extending',
  'needles-opening': 'needles opening',
  'needles-hardened': 'needles hardened',
  'beyond-silhouette': 'pushing out beyond it',
  'at-silhouette': 'within the outline',
  interior: 'deep inside',
  north: 'northern',
  south: 'southern',
  true: 'yes',
  false: 'no',
};
const show = (v: unknown) => valueLabels[String(v)] ?? String(v);

export default async function AnswerPage({ params }: { params: Promise<{ id: string }> }) {
  const { id } = await params;
  const user = await requirePageUser(`/answers/${id}`);
  const a = await getAnswer(id, user);
  if (!a) notFound();
  const [photos, trees] = await Promise.all([listPhotos(user, { answerId: a.id }), a.isOwner ? listTrees(user) : []]);
  const input: Record<string, unknown> = { ...a.input };
  const c = a.input.container;
  return (
    <div className="mx-auto max-w-xl space-y-5">
      <div>
        <h1 className="page-title">
          {a.speciesName}, {a.observedOn}
        </h1>
        <p className="text-stone-700" data-testid="asker">
          Asked by <strong>{a.askerName}</strong> on {a.createdAt.slice(0, 10)} ·{' '}
          {a.visibility === 'club' ? 'shared with the club' : 'only visible to the asker'}
        </p>
      </div>
      <AnswerResult result={a.result} />
      {a.phoneResult && <PhoneComparison phone={a.phoneResult as unknown as PhoneResult} server={a.result} />}
      <section className="card" aria-labelledby="inputs-h">
        <h2 id="inputs-h" className="text-lg">
          What was observed
        </h2>
        <dl className="mt-2 grid grid-cols-[10rem_1fr] gap-1">
          {inputLabels
            .filter(([k]) => input[k] !== undefined)
            .map(([k, label]) => (
              <div key={k} className="contents">
                <dt className="text-stone-700">{label}</dt>
                <dd>{show(input[k])}</dd>
              </div>
            ))}
          {c && (
            <div className="contents">
              <dt className="text-stone-700">Pot</dt>
              <dd>
                {c.shape}, {c.lengthCm}
                {c.widthCm ? ` × ${c.widthCm}` : ''} cm
              </dd>
            </div>
          )}
          <div className="contents">
            <dt className="text-stone-700">Rules version</dt>
            <dd>
              {a.engineVersion}, species revision {a.speciesRevision}
            </dd>
          </div>
        </dl>
        {!a.isOwner && a.note && (
          <p className="mt-3">
            <span className="font-medium">Note:</span> {a.note}
          </p>
        )}
        {!a.isOwner && a.followUp && (
          <p className="mt-2 whitespace-pre-wrap">
            <span className="font-medium">What happened:</span> {a.followUp}
          </p>
        )}
      </section>
      <PhotoPanel target={{ answerId: a.id }} initial={photos} canAdd={a.isOwner} label="Shoot photos" />
      <Backlinks type="answer" id={a.id} />
      {a.isOwner && (
        <OwnerControls
          id={a.id}
          initial={{ note: a.note, followUp: a.followUp, visibility: a.visibility, treeId: a.treeId }}
          trees={trees.map((t) => ({ id: t.id, name: t.name }))}
        />
      )}
      <RerunPanel id={a.id} />
      <p>
        <Link href={a.isOwner ? '/answers' : '/ask'}>{a.isOwner ? '← All your answers' : 'Ask about your own tree'}</Link>
      </p>
    </div>
  );
}
