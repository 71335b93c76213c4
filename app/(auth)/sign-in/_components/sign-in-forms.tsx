'use client';
import { signIn } from 'next-auth/react';
import { useRouter } from 'next/navigation';
import { useState, type FormEvent } from 'react';
import { safeCallbackPath } from '@/lib/http/safe-redirect';

const messages: Record<string, string> = {
  CredentialsSignin: 'E-mail or password is not right.',
  RateLimited: 'Too many attempts. Wait a minute and try again.',
};

export function SignInForms({ callbackUrl, email = '' }: { callbackUrl: string; email?: string }) {
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [pending, setPending] = useState(false);
  const [linkState, setLinkState] = useState<'idle' | 'sending' | 'sent' | 'failed'>('idle');

  async function onPassword(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setPending(true);
    setError(null);
    const res = await signIn('credentials', {
      email: String(form.get('email') ?? ''),
      password: String(form.get('password') ?? ''),
      redirect: false,
    });
    setPending(false);
    if (res?.ok && !res.error) {
      // Checked again here, against the page's own origin, right before the router follows it.
      router.push(safeCallbackPath(callbackUrl, window.location.origin));
      router.refresh();
    } else {
      setError(res?.status === 429 ? messages.RateLimited : (messages[res?.error ?? ''] ?? messages.CredentialsSignin));
    }
  }

  async function onLink(e: FormEvent<HTMLFormElement>) {
    e.preventDefault();
    const form = new FormData(e.currentTarget);
    setLinkState('sending');
    const res = await signIn('email', { email: String(form.get('email') ?? ''), redirect: false, callbackUrl });
    setLinkState(res?.ok && !res.error ? 'sent' : 'failed');
  }

  return (
    <div className="space-y-6">
      <form onSubmit={onPassword} className="card space-y-4" aria-labelledby="pw-heading" data-testid="password-form">
        <h2 id="pw-heading" className="text-xl">
          With your password
        </h2>
        <div>
          <label htmlFor="email" className="field-label">
            E-mail
          </label>
          <input id="email" name="email" type="email" autoComplete="email" required className="field-input" defaultValue={email} />
        </div>
        <div>
          <label htmlFor="password" className="field-label">
            Password
          </label>
          <input id="password" name="password" type="password" autoComplete="current-password" required className="field-input" />
        </div>
        {error ? (
          <p role="alert" className="field-error">
            {error}
          </p>
        ) : null}
        <button type="submit" className="btn-primary w-full" disabled={pending}>
          {pending ? 'Signing in…' : 'Sign in'}
        </button>
      </form>
      <form onSubmit={onLink} className="card space-y-4" aria-labelledby="link-heading" data-testid="link-form">
        <h2 id="link-heading" className="text-xl">
          With a link by e-mail
        </h2>
        <p className="text-sm text-stone-700">We send a link that signs you in once, within 15 minutes.</p>
        <div>
          <label htmlFor="link-email" className="field-label">
            E-mail
          </label>
          <input id="link-email" name="email" type="email" autoComplete="email" required className="field-input" defaultValue={email} />
        </div>
        <div role="status" aria-live="polite">
          {linkState === 'sent' ? <p className="text-moss-800">If that address belongs to an account, the link is on its way. Check your inbox.</p> : null}
          {linkState === 'failed' ? <p className="field-error">The link could not be sent. Try again.</p> : null}
        </div>
        <button type="submit" className="btn-secondary w-full" disabled={linkState === 'sending'}>
          {linkState === 'sending' ? 'Sending…' : 'E-mail me a link'}
        </button>
      </form>
    </div>
  );
}
