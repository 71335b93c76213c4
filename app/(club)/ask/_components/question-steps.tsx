'use client';
import { useMemo, useState } from 'react';
import { buildSpeciesIndex, searchSpecies } from '@/lib/species/search';
import { asksBackBuds, asksCandleStrength, isRecovering, NOT_MINE, type AskAnswers, type TreeOption } from '@/lib/wizard/ask-steps';
import { POT_MAX_CM, POT_MIN_CM } from '@/lib/validation/container';
import type { ContainerShape } from '@/lib/wizard/types';
import { Choices } from './choices';
import { BranchingDrawing, PositionDrawing, ShootDrawing } from '@/components/wizard/drawings';

export interface SpeciesName {
  slug: string;
  botanicalName: string;
  commonNames: string[];
  synonyms: string[];
}

type Set = (a: Partial<AskAnswers>) => void;

export function TreeStep({ trees, value, onPick }: { trees: TreeOption[]; value?: string; onPick: (treeId: string | null) => void }) {
  return (
    <Choices
      name="tree"
      legend="Which of your trees is it?"
      hint="Its species and pot are filled in, and the answer is kept with the tree."
      value={value}
      onChange={(v) => onPick(v === NOT_MINE ? null : v)}
      options={[
        ...trees.map((t) => ({ value: t.id, title: t.name, detail: t.speciesName })),
        { value: NOT_MINE, title: 'Not one of mine', detail: 'Another tree: a friend’s, or one at the nursery.' },
      ]}
    />
  );
}

export function SpeciesStep({ species, value, onChange }: { species: SpeciesName[]; value?: string; onChange: Set }) {
  const [query, setQuery] = useState('');
  // The species list's own ranking, so the picker and /species agree on what a query means.
  const index = useMemo(() => buildSpeciesIndex(species), [species]);
  const shown = query.trim()
    ? searchSpecies(species, query, index)
        .map((r) => r.item)
        .slice(0, 8)
    : species;
  const chosen = species.find((s) => s.slug === value);
  return (
    <div className="space-y-4">
      <h2 className="font-display text-xl text-moss-900">Which tree is it?</h2>
      {chosen && (
        <p className="rounded-lg bg-moss-50 p-3" data-testid="species-chosen">
          Chosen: <strong>{chosen.commonNames[0]}</strong> <em>({chosen.botanicalName})</em>
        </p>
      )}
      <div>
        <label htmlFor="species-search" className="field-label">
          Search by common or botanical name
        </label>
        <input
          id="species-search"
          type="search"
          className="field-input"
          value={query}
          onChange={(e) => setQuery(e.target.value)}
          placeholder="e.g. Scots pine"
          autoComplete="off"
        />
      </div>
      <ul className="space-y-2" data-testid="species-results">
        {shown.map((s) => (
          <li key={s.slug}>
            <button
              type="button"
              onClick={() => onChange({ species: s.slug })}
              aria-pressed={s.slug === value}
              className={`flex min-h-target w-full flex-col items-start rounded-card border-2 bg-white px-4 py-2 text-left ${s.slug === value ? 'border-moss-600 bg-moss-50' : 'border-stone-200'}`}
            >
              <span className="text-lg font-semibold text-stone-900">{s.commonNames[0]}</span>
              <span className="text-sm italic text-stone-700">{s.botanicalName}</span>
            </button>
          </li>
        ))}
        {!shown.length && <li className="text-stone-700">No species matches “{query}”. Try another name.</li>}
      </ul>
    </div>
  );
}

export function BranchingStep({ answers, onChange }: { answers: AskAnswers; onChange: Set }) {
  return (
    <div className="space-y-6">
      <Choices
        name="branching"
        legend="How far is the branching of this branch?"
        hint="Look at one branch from the trunk outwards."
        value={answers.branching}
        onChange={(v) => onChange({ branching: v })}
        options={[
          {
            value: 'primary',
            title: 'Primary only',
            detail: 'One limb from the trunk, few or no side branches.',
            picture: <BranchingDrawing level="primary" />,
          },
          {
            value: 'secondary',
            title: 'Primary and secondary',
            detail: 'The limb has side branches, but they do not fork again.',
            picture: <BranchingDrawing level="secondary" />,
          },
          {
            value: 'tertiary',
            title: 'Primary, secondary and tertiary',
            detail: 'The side branches fork again into small twigs that carry pads of foliage.',
            picture: <BranchingDrawing level="tertiary" />,
          },
        ]}
      />
      {asksCandleStrength(answers) && (
        <Choices
          name="candleStrength"
          legend="How strong is this shoot against the others on the tree? (optional)"
          value={answers.candleStrength}
          onChange={(v) => onChange({ candleStrength: v })}
          options={[
            { value: 'strong', title: 'One of the strongest', detail: 'Longer and thicker than most of the tree’s new shoots.' },
            { value: 'average', title: 'About average', detail: 'Like most of the new shoots on the tree.' },
            { value: 'weak', title: 'Weaker than most', detail: 'Short or thin next to the others.' },
          ]}
        />
      )}
      {asksBackBuds(answers) && (
        <Choices
          name="backBuds"
          legend="Are there back buds on older wood behind the tip?"
          value={answers.backBuds === undefined ? undefined : answers.backBuds ? 'yes' : 'no'}
          onChange={(v) => onChange({ backBuds: v === 'yes' })}
          options={[
            { value: 'yes', title: 'Yes', detail: 'Small new buds have formed behind the tip.' },
            { value: 'no', title: 'Not yet', detail: 'No buds behind the tip so far.' },
          ]}
        />
      )}
    </div>
  );
}

export function ShootStep({ value, onChange }: { value?: AskAnswers['shoot']; onChange: Set }) {
  return (
    <Choices
      name="shoot"
      legend="What does this year’s shoot look like?"
      hint="Look at the newest growth at the tip."
      value={value}
      onChange={(v) => onChange({ shoot: v })}
      options={[
        { value: 'dormant-bud', title: 'Dormant bud', detail: 'A closed bud; nothing has grown yet.', picture: <ShootDrawing state="dormant-bud" /> },
        {
          value: 'candle-extending',
          title: 'Candle extending',
          detail: 'A soft, single pale cylinder is lengthening; no needles stand out from it.',
          picture: <ShootDrawing state="candle-extending" />,
        },
        {
          value: 'needles-opening',
          title: 'Needles opening',
          detail: 'Short needles are starting to separate from the candle.',
          picture: <ShootDrawing state="needles-opening" />,
        },
        {
          value: 'needles-hardened',
          title: 'Needles hardened',
          detail: 'The new needles are full length, firm and dark.',
          picture: <ShootDrawing state="needles-hardened" />,
        },
      ]}
    />
  );
}

export function PositionStep({ value, onChange }: { value?: AskAnswers['position']; onChange: Set }) {
  return (
    <Choices
      name="position"
      legend="Where is the shoot against the tree’s outline?"
      hint="The silhouette is the outline of the foliage pad or crown you want to keep."
      value={value}
      onChange={(v) => onChange({ position: v })}
      options={[
        {
          value: 'beyond-silhouette',
          title: 'Pushing out beyond it',
          detail: 'The shoot sticks out past the outline.',
          picture: <PositionDrawing position="beyond-silhouette" />,
        },
        {
          value: 'at-silhouette',
          title: 'Within the outline',
          detail: 'The tip is at or just inside the outline.',
          picture: <PositionDrawing position="at-silhouette" />,
        },
        {
          value: 'interior',
          title: 'Deep inside',
          detail: 'An interior or weak shoot, well inside the pad.',
          picture: <PositionDrawing position="interior" />,
        },
      ]}
    />
  );
}

export function HealthStep({ answers, onChange }: { answers: AskAnswers; onChange: Set }) {
  return (
    <div className="space-y-6">
      <Choices
        name="health"
        legend="How is the tree doing?"
        value={answers.health}
        onChange={(v) => onChange({ health: v })}
        options={[
          { value: 'strong', title: 'Strong', detail: 'Long, dark needles and plenty of new growth.' },
          { value: 'average', title: 'Average', detail: 'Growing normally, nothing remarkable.' },
          { value: 'weak', title: 'Weak', detail: 'Short or yellowing needles, little growth, recently stressed.' },
        ]}
      />
      <label className="flex min-h-target cursor-pointer items-center gap-3 rounded-card border-2 border-stone-200 bg-white p-3">
        <input
          type="checkbox"
          className="h-6 w-6 accent-moss-700"
          checked={!!answers.recentlyCollected}
          onChange={(e) => onChange({ recentlyCollected: e.target.checked })}
        />
        <span className="text-lg">Collected from the wild within the last two years</span>
      </label>
      <label className="flex min-h-target cursor-pointer items-center gap-3 rounded-card border-2 border-stone-200 bg-white p-3">
        <input
          type="checkbox"
          className="h-6 w-6 accent-moss-700"
          checked={!!answers.repottedThisYear}
          onChange={(e) => onChange({ repottedThisYear: e.target.checked })}
          data-testid="repotted-this-year"
        />
        <span className="text-lg">Repotted this year</span>
      </label>
      {isRecovering(answers) && (
        <p className="rounded-lg bg-moss-50 p-3" role="status" data-testid="recovery-note">
          A weak or recently collected tree is left to recover whatever its shape, so the questions about branching and the outline are skipped.
        </p>
      )}
    </div>
  );
}

export function WhenStep({
  answers,
  club,
  onChange,
}: {
  answers: AskAnswers;
  club: { hemisphere: 'north' | 'south'; latitude: number; name: string };
  onChange: Set;
}) {
  const c = answers.container;
  const setContainer = (patch: Partial<{ shape: ContainerShape | ''; lengthCm: string; widthCm: string }>) => {
    const shape = patch.shape !== undefined ? patch.shape : (c?.shape ?? '');
    if (!shape) return onChange({ container: undefined });
    const num = (s: string | undefined, old: number | undefined) => (s === undefined ? old : s === '' ? undefined : Number(s));
    const lengthCm = num(patch.lengthCm, c?.lengthCm);
    const widthCm = shape === 'round' ? undefined : num(patch.widthCm, c?.widthCm);
    onChange({ container: { shape, lengthCm: lengthCm as number, ...(widthCm !== undefined ? { widthCm } : {}) } });
  };
  return (
    <div className="space-y-6">
      <h2 className="font-display text-xl text-moss-900">When and where</h2>
      <div>
        <label htmlFor="ask-date" className="field-label">
          Date you looked at the tree
        </label>
        <input id="ask-date" type="date" className="field-input" value={answers.date ?? ''} onChange={(e) => onChange({ date: e.target.value })} required />
      </div>
      <Choices
        name="hemisphere"
        legend="Hemisphere"
        hint={`Club setting: ${club.hemisphere === 'north' ? 'northern' : 'southern'} hemisphere, latitude ${Math.abs(club.latitude)}°.`}
        value={answers.hemisphere ?? club.hemisphere}
        onChange={(v) => onChange({ hemisphere: v })}
        options={[
          { value: 'north', title: 'Northern', detail: 'Spring is March to May.' },
          { value: 'south', title: 'Southern', detail: 'Spring is September to November.' },
        ]}
      />
      <div>
        <label htmlFor="ask-lat" className="field-label">
          Latitude in degrees (optional, for day length)
        </label>
        <input
          id="ask-lat"
          type="number"
          inputMode="decimal"
          step="0.1"
          min={-90}
          max={90}
          className="field-input"
          value={answers.latitude ?? ''}
          onChange={(e) => onChange({ latitude: e.target.value === '' ? undefined : Number(e.target.value) })}
          placeholder={String(club.latitude)}
        />
      </div>
      <fieldset className="space-y-3">
        <legend className="font-display text-xl text-moss-900">The pot (optional, for the feeding plan)</legend>
        <div>
          <label htmlFor="pot-shape" className="field-label">
            Shape
          </label>
          <select
            id="pot-shape"
            className="field-input"
            value={c?.shape ?? ''}
            onChange={(e) => setContainer({ shape: e.target.value as ContainerShape | '' })}
          >
            <option value="">No pot given (plan for a mid-sized pot)</option>
            <option value="round">Round</option>
            <option value="rectangle">Rectangular</option>
            <option value="oval">Oval</option>
          </select>
        </div>
        {c && (
          <div className="grid grid-cols-2 gap-3">
            <div>
              <label htmlFor="pot-length" className="field-label">
                {c.shape === 'round' ? 'Diameter (cm)' : 'Length (cm)'}
              </label>
              <input
                id="pot-length"
                type="number"
                inputMode="decimal"
                min={POT_MIN_CM}
                max={POT_MAX_CM}
                className="field-input"
                value={Number.isFinite(c.lengthCm) ? c.lengthCm : ''}
                onChange={(e) => setContainer({ lengthCm: e.target.value })}
              />
            </div>
            {c.shape !== 'round' && (
              <div>
                <label htmlFor="pot-width" className="field-label">
                  Width (cm)
                </label>
                <input
                  id="pot-width"
                  type="number"
                  inputMode="decimal"
                  min={POT_MIN_CM}
                  max={POT_MAX_CM}
                  className="field-input"
                  value={c.widthCm ?? ''}
                  onChange={(e) => setContainer({ widthCm: e.target.value })}
                />
              </div>
            )}
          </div>
        )}
      </fieldset>
    </div>
  );
}
