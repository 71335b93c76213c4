'use client';
import { useState } from 'react';
import { useRouter } from 'next/navigation';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { mutate } from 'swr';
import { ApiError, sendJson } from '@/components/fetcher';
import { useOnline } from '@/components/offline/offline-banner';
import { containerShapeLabels, containerShapes, emptyTree, todayIso, treeInputSchema, type TreeInput } from '@/lib/validation/trees';
import type { SpeciesOptionDto, TreeDto } from '@/lib/data/trees';

const toNumberOrNull = (v: unknown) => (v === '' || v == null || Number.isNaN(v) ? null : Number(v));
const toStringOrNull = (v: unknown) => (v === '' || v == null ? null : String(v));

export function TreeForm({ species, initial, treeId }: { species: SpeciesOptionDto[]; initial?: TreeInput; treeId?: string }) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const online = useOnline();
  const {
    register,
    handleSubmit,
    watch,
    setValue,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<TreeInput>({ resolver: zodResolver(treeInputSchema), defaultValues: initial ?? emptyTree });

  const shape = watch('containerShape');
  const collected = watch('collectedFromWild');
  const today = todayIso();

  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    try {
      const res = treeId
        ? await sendJson<{ tree: TreeDto }>(`/api/trees/${treeId}`, 'PATCH', values)
        : await sendJson<{ tree: TreeDto }>('/api/trees', 'POST', values);
      await mutate('/api/trees');
      router.push(`/trees/${res.tree.id}`);
      router.refresh();
    } catch (e) {
      if (e instanceof ApiError && e.body.fields) {
        for (const [field, msgs] of Object.entries(e.body.fields)) {
          setError(field as keyof TreeInput, { message: msgs[0] });
        }
      }
      setMessage(e instanceof Error ? e.message : 'Could not save the tree.');
    }
  });

  const err = (name: keyof TreeInput) =>
    errors[name]?.message ? (
      <p id={`${name}-error`} className="field-error">
        {errors[name]?.message}
      </p>
    ) : null;
  const described = (name: keyof TreeInput) => (errors[name] ? { 'aria-invalid': true, 'aria-describedby': `${name}-error` } : {});

  return (
    <form onSubmit={onSubmit} className="card max-w-2xl space-y-5" noValidate data-testid="tree-form">
      <div>
        <label htmlFor="name" className="field-label">
          Name
        </label>
        <input id="name" className="field-input" autoComplete="off" {...register('name')} {...described('name')} />
        {err('name')}
      </div>

      <div>
        <label htmlFor="speciesSlug" className="field-label">
          Species
        </label>
        <select id="speciesSlug" className="field-input" {...register('speciesSlug')} {...described('speciesSlug')}>
          <option value="">Choose a species…</option>
          {species.map((s) => (
            <option key={s.slug} value={s.slug}>
              {s.label}
            </option>
          ))}
        </select>
        {species.length === 0 ? <p className="mt-1 text-sm text-stone-700">No species are published yet: ask a species editor.</p> : null}
        {err('speciesSlug')}
      </div>

      <div>
        <label htmlFor="stageNotes" className="field-label">
          Stage notes
        </label>
        <p id="stageNotes-hint" className="mb-1 text-sm text-stone-700">
          Where the tree stands: e.g. “primary branches set, building secondaries on the lower pads”.
        </p>
        <textarea id="stageNotes" rows={3} className="field-input" aria-describedby="stageNotes-hint" {...register('stageNotes')} />
        {err('stageNotes')}
      </div>

      <fieldset className="space-y-3">
        <legend className="field-label">Container</legend>
        <p className="text-sm text-stone-700">The soil surface decides how many piles of feed the plan suggests. Measure inside the rim.</p>
        <div className="grid gap-3 sm:grid-cols-3">
          <div>
            <label htmlFor="containerShape" className="field-label">
              Shape
            </label>
            <select
              id="containerShape"
              className="field-input"
              {...register('containerShape', { setValueAs: toStringOrNull })}
              {...described('containerShape')}
            >
              <option value="">Not given</option>
              {containerShapes.map((s) => (
                <option key={s} value={s}>
                  {containerShapeLabels[s]}
                </option>
              ))}
            </select>
            {err('containerShape')}
          </div>
          {shape ? (
            <div>
              <label htmlFor="containerLengthCm" className="field-label">
                {shape === 'round' ? 'Diameter (cm)' : 'Length (cm)'}
              </label>
              <input
                id="containerLengthCm"
                type="number"
                inputMode="decimal"
                step="0.1"
                min="1"
                className="field-input"
                {...register('containerLengthCm', { setValueAs: toNumberOrNull })}
                {...described('containerLengthCm')}
              />
              {err('containerLengthCm')}
            </div>
          ) : null}
          {shape && shape !== 'round' ? (
            <div>
              <label htmlFor="containerWidthCm" className="field-label">
                Width (cm)
              </label>
              <input
                id="containerWidthCm"
                type="number"
                inputMode="decimal"
                step="0.1"
                min="1"
                className="field-input"
                {...register('containerWidthCm', { setValueAs: toNumberOrNull })}
                {...described('containerWidthCm')}
              />
              {err('containerWidthCm')}
            </div>
          ) : null}
        </div>
      </fieldset>

      <div>
        <label htmlFor="acquiredOn" className="field-label">
          Date acquired
        </label>
        <input
          id="acquiredOn"
          type="date"
          max={today}
          className="field-input sm:max-w-60"
          {...register('acquiredOn', { setValueAs: toStringOrNull })}
          {...described('acquiredOn')}
        />
        {err('acquiredOn')}
      </div>

      <fieldset className="space-y-2">
        <legend className="field-label">Collected from the wild?</legend>
        <div className="flex flex-wrap gap-4">
          <label className="flex min-h-target items-center gap-2">
            <input
              type="radio"
              name="collectedFromWild"
              className="h-5 w-5"
              checked={collected === true}
              onChange={() => setValue('collectedFromWild', true, { shouldDirty: true })}
            />
            Yes
          </label>
          <label className="flex min-h-target items-center gap-2">
            <input
              type="radio"
              name="collectedFromWild"
              className="h-5 w-5"
              checked={collected === false}
              onChange={() => {
                setValue('collectedFromWild', false, { shouldDirty: true });
                setValue('collectedOn', null);
              }}
            />
            No
          </label>
        </div>
        {collected ? (
          <>
            <div role="note" className="rounded-lg border border-sun-500 bg-sun-100 p-3 text-sm text-stone-900" data-testid="collecting-caution">
              Collect only with the landowner’s permission and any permit your local rules require. Many wild trees and places are protected; check the rules
              where you dig, and leave the site as you found it.
            </div>
            <div>
              <label htmlFor="collectedOn" className="field-label">
                Date collected
              </label>
              <input
                id="collectedOn"
                type="date"
                max={today}
                className="field-input sm:max-w-60"
                {...register('collectedOn', { setValueAs: toStringOrNull })}
                {...described('collectedOn')}
              />
              <p className="mt-1 text-sm text-stone-700">A tree collected in the last two years is treated as recovering: let it grow and rebuild roots.</p>
              {err('collectedOn')}
            </div>
          </>
        ) : null}
        {err('collectedFromWild')}
      </fieldset>

      <div>
        <label htmlFor="notes" className="field-label">
          Notes
        </label>
        <textarea id="notes" rows={4} className="field-input" {...register('notes')} {...described('notes')} />
        {err('notes')}
      </div>

      <div className="flex flex-wrap items-center gap-3">
        <button type="submit" className="btn-primary" disabled={isSubmitting || !online}>
          {treeId ? 'Save changes' : 'Add tree'}
        </button>
        {!online && (
          <p className="text-stone-700" data-testid="tree-offline">
            Saving a tree needs a connection.
          </p>
        )}
        <span role="status" className="text-sm text-clay-700">
          {message}
        </span>
      </div>
    </form>
  );
}
