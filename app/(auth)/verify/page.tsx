import type { Metadata } from 'next';

export const metadata: Metadata = { title: 'Check your e-mail' };

export default function VerifyPage() {
  return (
    <div className="card mx-auto max-w-md space-y-3">
      <h1 className="page-title">Check your e-mail</h1>
      <p className="text-stone-700">If the address belongs to an account, a sign-in link is on its way. It works once and expires in 15 minutes.</p>
    </div>
  );
}
