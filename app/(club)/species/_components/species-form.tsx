'use client';
import { useDeferredValue, useEffect, useMemo, useRef, useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { Controller, useFieldArray, useForm, useWatch, type Path } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import type { z } from 'zod';
import { ApiError, sendJson } from '@/components/fetcher';
import { renderMarkdownSync } from '@/lib/markdown/render';
import { groupLabels, provenanceLabels, traitOrder } from '@/lib/species/labels';
import { missingCitations, provenanceKinds, speciesCreateSchema, speciesGroups, type SpeciesRecord } from '@/lib/validation/species';
import { errorAt } from './form-errors';
import { TraitFields, type FormIn } from './trait-fields';

type FormOut = z.output<typeof speciesCreateSchema>;

/** Empty optional strings are dropped so the stored record stays tidy. */
function tidy(rec: SpeciesRecord): SpeciesRecord {
  const out = structuredClone(rec);
  for (const t of Object.values(out.traits) as { citation?: string; note?: string }[]) {
    if (!t.citation) delete t.citation;
    if (!t.note) delete t.note;
  }
  for (const c of out.cautions) if (!c.citation) delete c.citation;
  return out;
}

function ListField({
  name,
  label,
  hint,
  control,
  error,
}: {
  name: 'record.commonNames' | 'record.synonyms';
  label: string;
  hint: string;
  control: ReturnType<typeof useForm<FormIn>>['control'];
  error?: string;
}) {
  const id = name.replace('.', '-');
  return (
    <div>
      <label htmlFor={id} className="field-label">
        {label}
      </label>
      <Controller
        control={control}
        name={name}
        render={({ field }) => (
          <textarea
            id={id}
            rows={3}
            className="field-input"
            aria-describedby={`${id}-hint`}
            aria-invalid={!!error}
            defaultValue={(field.value ?? []).join('\n')}
            onChange={(e) =>
              field.onChange(
                e.target.value
                  .split('\n')
                  .map((s) => s.trim())
                  .filter(Boolean),
              )
            }
            onBlur={field.onBlur}
          />
        )}
      />
      <p id={`${id}-hint`} className="mt-1 text-sm text-stone-700">
        {hint}
      </p>
      {error && (
        <p className="field-error" role="alert">
          {error}
        </p>
      )}
    </div>
  );
}

export function SpeciesForm({ mode, initial, body, baseRevision }: { mode: 'create' | 'edit'; initial: SpeciesRecord; body: string; baseRevision?: number }) {
  const router = useRouter();
  const [message, setMessage] = useState<{ tone: 'error' | 'ok'; text: string; conflict?: boolean } | null>(null);
  const form = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(speciesCreateSchema),
    defaultValues: { record: initial, body, summary: '', publish: false },
    mode: 'onBlur',
  });
  const { register, control, handleSubmit, setError, setValue, formState } = form;
  const { errors, isSubmitting } = formState;
  const cautions = useFieldArray({ control, name: 'record.cautions' });
  const source = useWatch({ control, name: 'body' }) ?? '';
  const deferred = useDeferredValue(source);
  // The same sanitizing pipeline the server uses, run in the browser for the live preview.
  const preview = useMemo(() => renderMarkdownSync(deferred), [deferred]);
  const err = (p: string) => errorAt(errors, p);
  const messageRef = useRef<HTMLDivElement>(null);
  // A message after Save or Publish takes the focus (field errors are announced beside each field).
  useEffect(() => {
    if (message) messageRef.current?.focus();
  }, [message]);

  const submit = (publish: boolean) =>
    handleSubmit(
      async (values) => {
        setMessage(null);
        if (publish) {
          // A draft may wait for a citation; publishing may not. Said beside each field, before sending.
          const uncited = missingCitations(values.record);
          if (Object.keys(uncited).length) {
            for (const [k, v] of Object.entries(uncited)) setError(`record.${k}` as Path<FormIn>, { message: v.join(' ') });
            setMessage({
              tone: 'error',
              text: `${Object.keys(uncited).length} published value(s) need a citation before publishing. Add them, or save as a draft.`,
            });
            return;
          }
        }
        const payload = { ...values, record: tidy(values.record), publish };
        try {
          const res =
            mode === 'create'
              ? await sendJson<{ species: { slug: string; revision: number } }>('/api/species', 'POST', payload)
              : await sendJson<{ species: { slug: string; revision: number } }>(`/api/species/${initial.slug}`, 'PATCH', { ...payload, baseRevision });
          const { slug, revision } = res.species;
          router.push(publish ? `/species/${slug}?published=${revision}` : `/species/${slug}?revision=${revision}&saved=1`);
          router.refresh();
        } catch (e) {
          if (e instanceof ApiError) {
            for (const [k, v] of Object.entries(e.body.fields ?? {})) setError(k as Path<FormIn>, { message: v.join(' ') });
            setMessage({ tone: 'error', text: e.body.message, conflict: e.status === 409 });
          } else setMessage({ tone: 'error', text: 'The server could not be reached. Your changes are still here; try again.' });
        }
      },
      () => setMessage({ tone: 'error', text: 'Some fields need attention; they are marked below.' }),
    );

  return (
    <form className="space-y-6" noValidate onSubmit={(e) => e.preventDefault()} data-testid="species-form">
      <section className="card space-y-4" aria-labelledby="identity-h">
        <h2 id="identity-h" className="text-xl">
          Identity
        </h2>
        <div className="grid gap-4 sm:grid-cols-2">
          <div>
            <label htmlFor="f-botanical" className="field-label">
              Botanical name
            </label>
            <input id="f-botanical" className="field-input italic" aria-invalid={!!err('record.botanicalName')} {...register('record.botanicalName')} />
            {err('record.botanicalName') && (
              <p className="field-error" role="alert">
                {err('record.botanicalName')}
              </p>
            )}
          </div>
          <div>
            <label htmlFor="f-slug" className="field-label">
              Slug (botanical name in kebab case)
            </label>
            <input
              id="f-slug"
              className="field-input"
              readOnly={mode === 'edit'}
              aria-readonly={mode === 'edit'}
              aria-invalid={!!err('record.slug')}
              {...register('record.slug')}
            />
            {mode === 'edit' && <p className="mt-1 text-sm text-stone-700">The slug cannot change once created.</p>}
            {err('record.slug') && (
              <p className="field-error" role="alert">
                {err('record.slug')}
              </p>
            )}
          </div>
          <div>
            <label htmlFor="f-genus" className="field-label">
              Genus
            </label>
            <input id="f-genus" className="field-input" {...register('record.genus')} />
            {err('record.genus') && (
              <p className="field-error" role="alert">
                {err('record.genus')}
              </p>
            )}
          </div>
          <div>
            <label htmlFor="f-group" className="field-label">
              Group
            </label>
            <select id="f-group" className="field-input" {...register('record.group')}>
              {speciesGroups.map((g) => (
                <option key={g} value={g}>
                  {groupLabels[g]}
                </option>
              ))}
            </select>
          </div>
          <ListField
            name="record.commonNames"
            label="Common names"
            hint="One a line; the first is the main name."
            control={control}
            error={err('record.commonNames')}
          />
          <ListField
            name="record.synonyms"
            label="Synonyms and other spellings"
            hint="One a line; search uses them too."
            control={control}
            error={err('record.synonyms')}
          />
        </div>
      </section>

      <section className="card space-y-4" aria-labelledby="traits-h">
        <h2 id="traits-h" className="text-xl">
          Traits and their sources
        </h2>
        {traitOrder.map((k) => (
          <TraitFields key={k} name={k} control={control} register={register} errors={errors} />
        ))}
      </section>

      <section className="card space-y-4" aria-labelledby="cautions-h">
        <h2 id="cautions-h" className="text-xl">
          Cautions
        </h2>
        {cautions.fields.length === 0 && <p className="text-stone-700">None yet.</p>}
        {cautions.fields.map((f, i) => (
          <fieldset key={f.id} className="grid gap-3 rounded-lg border border-stone-200 p-3 sm:grid-cols-2">
            <legend className="px-1 font-medium">Caution {i + 1}</legend>
            <div className="sm:col-span-2">
              <label htmlFor={`c-${i}-text`} className="field-label">
                Text
              </label>
              <textarea id={`c-${i}-text`} rows={2} className="field-input" {...register(`record.cautions.${i}.text`)} />
              {err(`record.cautions.${i}.text`) && (
                <p className="field-error" role="alert">
                  {err(`record.cautions.${i}.text`)}
                </p>
              )}
            </div>
            <div>
              <label htmlFor={`c-${i}-prov`} className="field-label">
                Source
              </label>
              <select id={`c-${i}-prov`} className="field-input" {...register(`record.cautions.${i}.provenance`)}>
                {provenanceKinds.map((p) => (
                  <option key={p} value={p}>
                    {provenanceLabels[p].option}
                  </option>
                ))}
              </select>
            </div>
            <div>
              <label htmlFor={`c-${i}-cit`} className="field-label">
                Citation
              </label>
              <input id={`c-${i}-cit`} className="field-input" {...register(`record.cautions.${i}.citation`)} />
            </div>
            <div className="sm:col-span-2">
              <button type="button" className="btn-secondary" onClick={() => cautions.remove(i)}>
                Remove caution {i + 1}
              </button>
            </div>
          </fieldset>
        ))}
        <button type="button" className="btn-secondary" onClick={() => cautions.append({ text: '', provenance: 'common-practice' })}>
          Add a caution
        </button>
      </section>

      <section className="card space-y-3" aria-labelledby="notes-h">
        <h2 id="notes-h" className="text-xl">
          Care notes (Markdown)
        </h2>
        <div className="grid gap-4 lg:grid-cols-2">
          <div>
            <label htmlFor="f-body" className="field-label">
              Source
            </label>
            <textarea
              id="f-body"
              rows={16}
              className="field-input font-mono text-sm"
              aria-invalid={!!err('body')}
              {...register('body')}
              data-testid="body-editor"
            />
            {err('body') && (
              <p className="field-error" role="alert">
                {err('body')}
              </p>
            )}
          </div>
          <div>
            <p className="field-label" id="preview-label">
              Preview (as members will see it)
            </p>
            <div
              aria-labelledby="preview-label"
              className="prose prose-stone min-h-40 max-w-none prose-headings:font-display prose-h2:mt-2 prose-h2:text-lg prose-h3:text-base rounded-lg border border-stone-200 bg-stone-50 p-3"
              data-testid="body-preview"
              dangerouslySetInnerHTML={{ __html: preview }}
            />
          </div>
        </div>
      </section>

      <section className="card space-y-4" aria-labelledby="save-h">
        <h2 id="save-h" className="text-xl">
          Save
        </h2>
        <div>
          <label htmlFor="f-summary" className="field-label">
            Edit summary
          </label>
          <input id="f-summary" className="field-input" placeholder="What changed and why" {...register('summary')} />
          {err('summary') && (
            <p className="field-error" role="alert">
              {err('summary')}
            </p>
          )}
        </div>
        {message && (
          <div
            ref={messageRef}
            tabIndex={-1}
            role="alert"
            className={`rounded-lg border p-3 ${message.tone === 'error' ? 'border-clay-500 bg-clay-100 text-clay-700' : 'border-moss-500 bg-moss-50'}`}
            data-testid="form-message"
          >
            <p>{message.text}</p>
            {message.conflict && (
              <p className="mt-1">
                Your changes are still in this form.{' '}
                <Link href={`/species/${initial.slug}/history`} target="_blank">
                  Open the history in a new tab
                </Link>{' '}
                to see what changed, then reload this page and make your change again.
              </p>
            )}
          </div>
        )}
        {err('baseRevision') && <p className="field-error">{err('baseRevision')}</p>}
        <p className="text-sm text-stone-700">
          A draft is visible to editors only and may leave a citation for later. Publishing makes it the revision members and the wizard use, and needs every
          citation.
        </p>
      </section>

      {/* The form is long: its actions stay on screen at the bottom while the editor scrolls. */}
      <div
        className="sticky bottom-0 z-10 rounded-t-card border border-b-0 border-stone-300 bg-white px-3 py-3 sm:px-4 shadow-[0_-2px_6px_rgba(0,0,0,0.08)]"
        data-testid="form-actions"
      >
        <div className="flex flex-wrap items-center gap-2 sm:gap-3">
          <button
            type="button"
            className="btn-secondary max-sm:px-3"
            disabled={isSubmitting}
            onClick={() => {
              setValue('publish', false);
              void submit(false)();
            }}
          >
            Save as draft
          </button>
          <button
            type="button"
            className="btn-primary max-sm:px-3"
            disabled={isSubmitting}
            onClick={() => {
              setValue('publish', true);
              void submit(true)();
            }}
            data-testid="publish"
          >
            Publish
          </button>
          <Link href={mode === 'edit' ? `/species/${initial.slug}` : '/species'} className="btn-secondary max-sm:px-3">
            Cancel
          </Link>
          {isSubmitting && (
            <span role="status" className="text-sm text-stone-700">
              Saving…
            </span>
          )}
        </div>
      </div>
    </form>
  );
}
