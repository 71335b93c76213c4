import type { Metadata } from 'next';
import { ConfirmSignUpForm } from './confirm-form';

export const metadata: Metadata = { title: 'Confirm your account', robots: { index: false } };

// Opening the link creates nothing by itself (mail scanners open links too): the new member
// confirms with one button.
export default async function ConfirmSignUpPage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const sp = await searchParams;
  const token = typeof sp.token === 'string' ? sp.token : '';
  return (
    <div className="card mx-auto max-w-xl space-y-4">
      <h1 className="page-title">Confirm your account</h1>
      {token ? (
        <ConfirmSignUpForm token={token} />
      ) : (
        <p role="alert">This link is incomplete. Open the link from the e-mail again, or sign up again for a new one.</p>
      )}
    </div>
  );
}
