'use client';
import { Controller, type Control, type FieldErrors, type UseFormRegister } from 'react-hook-form';
import type { z } from 'zod';
import { provenanceLabels, traitLabels, valueLabels } from '@/lib/species/labels';
import { flushHabits, levels, needleResponses, provenanceKinds, shootHabits, type speciesCreateSchema, type SpeciesTraits } from '@/lib/validation/species';
import { errorAt } from './form-errors';

export type FormIn = z.input<typeof speciesCreateSchema>;
type Key = keyof SpeciesTraits;

const selectOptions: Partial<Record<Key, readonly string[]>> = {
  flushHabit: flushHabits,
  shootHabit: shootHabits,
  vigour: levels,
  backBudding: levels,
  feedingNeedleResponse: needleResponses,
};

const hints: Partial<Record<Key, string>> = {
  flushHabit: 'As the trade uses it: double means a second flush can be induced by cutting spring candles.',
  shootHabit: 'As botany gives it (e.g. Shaw 1914); keep it apart from the flush habit.',
  needlesPerFascicle: 'Leave empty when the needles are not in bundles.',
  hardinessZones: 'Leave both empty when no zone is known.',
};

function Err({ id, msg }: { id: string; msg?: string }) {
  return msg ? (
    <p id={id} className="field-error" role="alert">
      {msg}
    </p>
  ) : null;
}

export function TraitFields({
  name,
  control,
  register,
  errors,
}: {
  name: Key;
  control: Control<FormIn>;
  register: UseFormRegister<FormIn>;
  errors: FieldErrors<FormIn>;
}) {
  const base = `record.traits.${name}` as const;
  const id = `trait-${name}`;
  const e = (p: string) => errorAt(errors, `${base}.${p}`);
  const options = selectOptions[name];
  const valueErr = e('value') ?? e('value.min') ?? e('value.max');

  let valueInput: React.ReactNode;
  if (options) {
    valueInput = (
      <select id={`${id}-value`} className="field-input" aria-invalid={!!valueErr} {...register(`${base}.value` as 'record.traits.vigour.value')}>
        {options.map((o) => (
          <option key={o} value={o}>
            {valueLabels[o] ?? o}
          </option>
        ))}
      </select>
    );
  } else if (name === 'needlesPerFascicle') {
    valueInput = (
      <input
        id={`${id}-value`}
        type="number"
        inputMode="numeric"
        min={1}
        max={8}
        className="field-input"
        aria-invalid={!!valueErr}
        {...register('record.traits.needlesPerFascicle.value', { setValueAs: (v) => (v === '' || v == null ? null : Number(v)) })}
      />
    );
  } else if (name === 'needleLengthMm') {
    valueInput = (
      <div className="flex items-center gap-2">
        <label className="sr-only" htmlFor={`${id}-value`}>
          Shortest (mm)
        </label>
        <input
          id={`${id}-value`}
          type="number"
          step="any"
          className="field-input"
          aria-invalid={!!valueErr}
          {...register('record.traits.needleLengthMm.value.min', { valueAsNumber: true })}
        />
        <span aria-hidden>–</span>
        <label className="sr-only" htmlFor={`${id}-max`}>
          Longest (mm)
        </label>
        <input
          id={`${id}-max`}
          type="number"
          step="any"
          className="field-input"
          aria-invalid={!!valueErr}
          {...register('record.traits.needleLengthMm.value.max', { valueAsNumber: true })}
        />
        <span className="text-sm text-stone-700">mm</span>
      </div>
    );
  } else if (name === 'hardinessZones') {
    valueInput = (
      <Controller
        control={control}
        name="record.traits.hardinessZones.value"
        render={({ field }) => {
          const v = field.value as { min: number; max: number } | null;
          const change = (which: 'min' | 'max', raw: string) => {
            const other = which === 'min' ? v?.max : v?.min;
            const n = raw === '' ? undefined : Number(raw);
            if (n === undefined && (other === undefined || Number.isNaN(other))) return field.onChange(null);
            field.onChange({ min: v?.min ?? NaN, max: v?.max ?? NaN, [which]: n ?? NaN });
          };
          const show = (x?: number) => (x === undefined || Number.isNaN(x) ? '' : String(x));
          return (
            <div className="flex items-center gap-2">
              <label className="sr-only" htmlFor={`${id}-value`}>
                Coldest zone
              </label>
              <input
                id={`${id}-value`}
                type="number"
                min={1}
                max={13}
                className="field-input"
                value={show(v?.min)}
                onChange={(ev) => change('min', ev.target.value)}
                onBlur={field.onBlur}
              />
              <span aria-hidden>–</span>
              <label className="sr-only" htmlFor={`${id}-max`}>
                Warmest zone
              </label>
              <input
                id={`${id}-max`}
                type="number"
                min={1}
                max={13}
                className="field-input"
                value={show(v?.max)}
                onChange={(ev) => change('max', ev.target.value)}
                onBlur={field.onBlur}
              />
            </div>
          );
        }}
      />
    );
  } else {
    valueInput = <textarea id={`${id}-value`} rows={2} className="field-input" aria-invalid={!!valueErr} {...register('record.traits.nativeRange.value')} />;
  }

  return (
    <fieldset className="rounded-lg border border-stone-200 p-3" data-testid={`field-${name}`}>
      <legend className="px-1 font-medium text-moss-900">{traitLabels[name]}</legend>
      {hints[name] && <p className="mb-2 text-sm text-stone-700">{hints[name]}</p>}
      <div className="grid gap-3 sm:grid-cols-2">
        <div>
          <label htmlFor={`${id}-value`} className="field-label">
            Value
          </label>
          {valueInput}
          <Err id={`${id}-value-err`} msg={valueErr} />
        </div>
        <div>
          <label htmlFor={`${id}-prov`} className="field-label">
            Source
          </label>
          <select id={`${id}-prov`} className="field-input" {...register(`${base}.provenance` as 'record.traits.vigour.provenance')}>
            {provenanceKinds.map((p) => (
              <option key={p} value={p}>
                {provenanceLabels[p].option}
              </option>
            ))}
          </select>
          <Err id={`${id}-prov-err`} msg={e('provenance')} />
        </div>
        <div>
          <label htmlFor={`${id}-cit`} className="field-label">
            Citation (needed to publish; a draft can wait)
          </label>
          <input id={`${id}-cit`} className="field-input" aria-invalid={!!e('citation')} {...register(`${base}.citation` as 'record.traits.vigour.citation')} />
          <Err id={`${id}-cit-err`} msg={e('citation')} />
        </div>
        <div>
          <label htmlFor={`${id}-note`} className="field-label">
            Note (optional)
          </label>
          <input id={`${id}-note`} className="field-input" {...register(`${base}.note` as 'record.traits.vigour.note')} />
          <Err id={`${id}-note-err`} msg={e('note')} />
        </div>
      </div>
    </fieldset>
  );
}
