'use client';
import type { ReactNode } from 'react';

export interface ChoiceOption<T extends string> {
  value: T;
  title: string;
  detail: string;
  picture?: ReactNode;
}

/** A group of large tap targets (native radios) with a picture and words for each option. */
export function Choices<T extends string>({
  name,
  legend,
  hint,
  options,
  value,
  onChange,
}: {
  name: string;
  legend: string;
  hint?: string;
  options: ChoiceOption<T>[];
  value: T | undefined;
  onChange: (v: T) => void;
}) {
  return (
    <fieldset className="space-y-3">
      <legend className="mb-2 font-display text-xl text-moss-900">{legend}</legend>
      {hint && <p className="-mt-1 mb-2 text-stone-700">{hint}</p>}
      {options.map((o) => {
        const checked = value === o.value;
        return (
          <label
            key={o.value}
            data-testid={`choice-${name}-${o.value}`}
            className={`flex min-h-target cursor-pointer items-center gap-4 rounded-card border-2 bg-white p-3 ${
              checked ? 'border-moss-600 bg-moss-50 ring-2 ring-moss-300' : 'border-stone-200'
            } has-[:focus-visible]:outline has-[:focus-visible]:outline-2 has-[:focus-visible]:outline-bark-600`}
          >
            <input type="radio" name={name} value={o.value} checked={checked} onChange={() => onChange(o.value)} className="sr-only" />
            {o.picture && <span className="shrink-0">{o.picture}</span>}
            <span className="min-w-0">
              <span className="block text-lg font-semibold text-stone-900">{o.title}</span>
              <span className="block text-stone-700">{o.detail}</span>
            </span>
            <span
              aria-hidden="true"
              className={`ml-auto h-6 w-6 shrink-0 rounded-full border-2 ${checked ? 'border-moss-700 bg-moss-700 shadow-[inset_0_0_0_3px_white]' : 'border-stone-400'}`}
            />
          </label>
        );
      })}
    </fieldset>
  );
}
