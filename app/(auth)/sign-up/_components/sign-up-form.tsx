'use client';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { useEffect, useRef, useState } from 'react';
import { signUpSchema, type SignUpInput } from '@/lib/validation/auth';
import { ApiError, sendJson } from '@/components/fetcher';

export function SignUpForm() {
  const [sentTo, setSentTo] = useState<string | null>(null);
  const noticeRef = useRef<HTMLDivElement>(null);
  useEffect(() => {
    if (sentTo) noticeRef.current?.focus();
  }, [sentTo]);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<SignUpInput>({
    resolver: zodResolver(signUpSchema),
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      const res = await sendJson<{ email: string }>('/api/users', 'POST', values);
      setSentTo(res.email);
    } catch (e) {
      if (e instanceof ApiError && e.body.fields) {
        for (const [field, msgs] of Object.entries(e.body.fields)) {
          setError(field as keyof SignUpInput, { message: msgs[0] });
        }
      } else {
        setError('root', { message: e instanceof Error ? e.message : 'Sign-up failed.' });
      }
      return;
    }
  });

  if (sentTo) {
    // The same words whether or not the address already has an account: its owner learns which by e-mail.
    return (
      <div ref={noticeRef} tabIndex={-1} role="status" className="card space-y-3" data-testid="sign-up-sent">
        <h2 className="text-xl">Check your e-mail</h2>
        <p>
          We sent a message to <strong className="break-all">{sentTo}</strong> with the next step. Open the link in it to finish; it works for 24 hours.
        </p>
        <p className="text-sm text-stone-700">Nothing there after a few minutes? Look in the spam folder, or sign up again to get a new message.</p>
      </div>
    );
  }

  return (
    <form onSubmit={onSubmit} className="card space-y-4" noValidate data-testid="sign-up-form">
      <div>
        <label htmlFor="name" className="field-label">
          Your name
        </label>
        <input id="name" autoComplete="name" className="field-input" aria-invalid={!!errors.name} aria-describedby="name-err" {...register('name')} />
        {errors.name ? (
          <p id="name-err" className="field-error">
            {errors.name.message}
          </p>
        ) : null}
      </div>
      <div>
        <label htmlFor="email" className="field-label">
          E-mail
        </label>
        <input
          id="email"
          type="email"
          autoComplete="email"
          className="field-input"
          aria-invalid={!!errors.email}
          aria-describedby="email-err"
          {...register('email')}
        />
        {errors.email ? (
          <p id="email-err" className="field-error">
            {errors.email.message}
          </p>
        ) : null}
      </div>
      <div>
        <label htmlFor="password" className="field-label">
          Password
        </label>
        <input
          id="password"
          type="password"
          autoComplete="new-password"
          className="field-input"
          aria-invalid={!!errors.password}
          aria-describedby="password-help password-err"
          {...register('password')}
        />
        <p id="password-help" className="mt-1 text-sm text-stone-600">
          8 to 128 characters; common passwords are refused.
        </p>
        {errors.password ? (
          <p id="password-err" className="field-error">
            {errors.password.message}
          </p>
        ) : null}
      </div>
      {errors.root ? (
        <p role="alert" className="field-error">
          {errors.root.message}
        </p>
      ) : null}
      <button type="submit" className="btn-primary w-full" disabled={isSubmitting}>
        {isSubmitting ? 'Creating…' : 'Create account'}
      </button>
    </form>
  );
}
