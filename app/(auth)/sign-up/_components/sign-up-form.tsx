'use client';
import { useForm } from 'react-hook-form';
import { zodResolver } from '@hookform/resolvers/zod';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { signUpSchema, type SignUpInput } from '@/lib/validation/auth';
import { ApiError, sendJson } from '@/components/fetcher';

export function SignUpForm() {
  const router = useRouter();
  const { register, handleSubmit, setError, formState: { errors, isSubmitting } } = useForm<SignUpInput>({
    resolver: zodResolver(signUpSchema),
  });

  const onSubmit = handleSubmit(async (values) => {
    try {
      await sendJson('/api/users', 'POST', values);
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
    const res = await signIn('credentials', { email: values.email, password: values.password, redirect: false });
    router.push(res?.ok ? '/' : '/sign-in');
    router.refresh();
  });

  return (
    <form onSubmit={onSubmit} className="card space-y-4" noValidate data-testid="sign-up-form">
      <div>
        <label htmlFor="name" className="field-label">Your name</label>
        <input id="name" autoComplete="name" className="field-input" aria-invalid={!!errors.name} aria-describedby="name-err" {...register('name')} />
        {errors.name ? <p id="name-err" className="field-error">{errors.name.message}</p> : null}
      </div>
      <div>
        <label htmlFor="email" className="field-label">E-mail</label>
        <input id="email" type="email" autoComplete="email" className="field-input" aria-invalid={!!errors.email} aria-describedby="email-err" {...register('email')} />
        {errors.email ? <p id="email-err" className="field-error">{errors.email.message}</p> : null}
      </div>
      <div>
        <label htmlFor="password" className="field-label">Password</label>
        <input id="password" type="password" autoComplete="new-password" className="field-input" aria-invalid={!!errors.password} aria-describedby="password-help password-err" {...register('password')} />
        <p id="password-help" className="mt-1 text-sm text-stone-600">8 to 128 characters; common passwords are refused.</p>
        {errors.password ? <p id="password-err" className="field-error">{errors.password.message}</p> : null}
      </div>
      {errors.root ? <p role="alert" className="field-error">{errors.root.message}</p> : null}
      <button type="submit" className="btn-primary w-full" disabled={isSubmitting}>{isSubmitting ? 'Creating…' : 'Create account'}</button>
    </form>
  );
}
