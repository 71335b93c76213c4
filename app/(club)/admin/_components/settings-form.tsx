'use client';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import type { z } from 'zod';
import { settingsSchema } from '@/lib/validation/auth';
import { ApiError, sendJson } from '@/components/fetcher';

type FormIn = z.input<typeof settingsSchema>;
type FormOut = z.output<typeof settingsSchema>;

export function SettingsForm({ initial }: { initial: FormOut }) {
  const [saved, setSaved] = useState(false);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, FormOut>({
    resolver: zodResolver(settingsSchema),
    defaultValues: initial,
  });
  const onSubmit = handleSubmit(async (values) => {
    setSaved(false);
    try {
      await sendJson('/api/settings', 'PUT', values);
      setSaved(true);
    } catch (e) {
      if (e instanceof ApiError && e.body.fields) {
        for (const [f, m] of Object.entries(e.body.fields)) setError(f as keyof FormIn, { message: m[0] });
      } else setError('root', { message: (e as Error).message });
    }
  });
  return (
    <form onSubmit={onSubmit} className="card grid gap-4 sm:grid-cols-2" noValidate data-testid="settings-form">
      <div>
        <label htmlFor="clubName" className="field-label">
          Club name
        </label>
        <input id="clubName" className="field-input" {...register('clubName')} />
        {errors.clubName ? <p className="field-error">{errors.clubName.message}</p> : null}
      </div>
      <div>
        <label htmlFor="hemisphere" className="field-label">
          Hemisphere
        </label>
        <select id="hemisphere" className="field-input" {...register('hemisphere')}>
          <option value="north">Northern</option>
          <option value="south">Southern</option>
        </select>
      </div>
      <div>
        <label htmlFor="defaultLatitude" className="field-label">
          Default latitude (°)
        </label>
        <input id="defaultLatitude" type="number" step="0.1" className="field-input" {...register('defaultLatitude')} />
        {errors.defaultLatitude ? <p className="field-error">{errors.defaultLatitude.message}</p> : null}
      </div>
      <div>
        <label htmlFor="decandleOffsetDays" className="field-label">
          Decandle window shift (days)
        </label>
        <input
          id="decandleOffsetDays"
          type="number"
          step="1"
          min={-30}
          max={30}
          className="field-input"
          aria-describedby="decandleOffsetDays-help"
          {...register('decandleOffsetDays')}
        />
        <p id="decandleOffsetDays-help" className="text-sm text-stone-600">
          The wizard times candle cutting on double-flush pines from your latitude. If your season runs earlier or later than that, move the window: negative is
          earlier, positive later (up to 30 days).
        </p>
        {errors.decandleOffsetDays ? <p className="field-error">{errors.decandleOffsetDays.message}</p> : null}
      </div>
      <div className="flex items-center gap-3 sm:col-span-2">
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          {isSubmitting ? 'Saving…' : 'Save settings'}
        </button>
        <span role="status" className="text-moss-800">
          {saved ? 'Saved.' : ''}
        </span>
        {errors.root ? (
          <span role="alert" className="field-error">
            {errors.root.message}
          </span>
        ) : null}
      </div>
    </form>
  );
}
