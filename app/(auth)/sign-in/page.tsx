import type { Metadata } from 'next';
import Link from 'next/link';
import { SignInForms } from './_components/sign-in-forms';
import { env } from '@/lib/env';
import { safeCallbackPath } from '@/lib/http/safe-redirect';

export const metadata: Metadata = { title: 'Sign in' };

const errors: Record<string, string> = {
  CredentialsSignin: 'E-mail or password is not right.',
  RateLimited: 'Too many attempts. Wait a minute and try again.',
  Verification: 'That sign-in link has been used already or has expired. Ask for a new one.',
  EmailSignin: 'The sign-in link could not be sent. Try again.',
  AccessDenied: 'This account cannot sign in. Ask a club administrator.',
};

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<{ error?: string; callbackUrl?: string; email?: string; confirmed?: string }>;
}) {
  const sp = await searchParams;
  const callbackUrl = safeCallbackPath(sp.callbackUrl, env.NEXTAUTH_URL);
  // Only a plausible address is put back into the form (it came from a link in our own e-mail).
  const email = typeof sp.email === 'string' && sp.email.length <= 254 && /^[^\s@]+@[^\s@]+$/.test(sp.email) ? sp.email : '';
  return (
    <div className="mx-auto max-w-md space-y-6">
      <h1 className="page-title">Sign in</h1>
      {sp.error ? (
        <p role="alert" className="rounded-lg bg-clay-100 p-3 text-clay-700">
          {errors[sp.error] ?? 'Sign-in failed. Try again.'}
        </p>
      ) : null}
      {sp.confirmed === '1' ? (
        <p role="status" className="rounded-lg bg-moss-50 p-3 text-moss-800" data-testid="account-ready">
          Your account is ready. Sign in with the password you chose.
        </p>
      ) : null}
      <SignInForms callbackUrl={callbackUrl} email={email} />
      <p className="text-stone-700">
        New to the club? <Link href="/sign-up">Create an account</Link>.
      </p>
    </div>
  );
}
