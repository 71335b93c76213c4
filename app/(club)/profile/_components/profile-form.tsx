'use client';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useState } from 'react';
import { profilePatchSchema } from '@/lib/validation/auth';
import { sendJson } from '@/components/fetcher';

type Values = { name?: string; digestOptIn?: boolean; reminderOptIn?: boolean };

export function ProfileForm({ initial }: { initial: Values }) {
  const [status, setStatus] = useState('');
  const {
    register,
    handleSubmit,
    formState: { errors, isSubmitting },
  } = useForm<Values>({
    resolver: zodResolver(profilePatchSchema),
    defaultValues: initial,
  });
  const onSubmit = handleSubmit(async (values) => {
    try {
      await sendJson('/api/me', 'PATCH', values);
      setStatus('Saved.');
    } catch (e) {
      setStatus((e as Error).message);
    }
  });
  return (
    <form onSubmit={onSubmit} className="card space-y-4" data-testid="profile-form">
      <div>
        <label htmlFor="name" className="field-label">
          Display name
        </label>
        <input id="name" className="field-input" {...register('name')} />
        {errors.name ? <p className="field-error">{errors.name.message}</p> : null}
      </div>
      <label className="flex min-h-target items-center gap-3">
        <input type="checkbox" className="h-5 w-5" {...register('digestOptIn')} />
        <span>Send me meeting notes by e-mail when the librarian publishes them</span>
      </label>
      <label className="flex min-h-target items-center gap-3">
        <input type="checkbox" className="h-5 w-5" {...register('reminderOptIn')} data-testid="reminder-opt-in" />
        <span>Send me a weekly e-mail of the tasks due on my trees</span>
      </label>
      <div className="flex items-center gap-3">
        <button type="submit" className="btn-primary" disabled={isSubmitting}>
          Save
        </button>
        <span role="status">{status}</span>
      </div>
    </form>
  );
}
