'use client';
import { useState } from 'react';
import Link from 'next/link';
import { useRouter } from 'next/navigation';
import { sendJson } from '@/components/fetcher';

export function ConfirmSignUpForm({ token }: { token: string }) {
  const router = useRouter();
  const [state, setState] = useState<{ kind: 'idle' | 'busy' } | { kind: 'error'; message: string }>({ kind: 'idle' });
  async function confirm() {
    setState({ kind: 'busy' });
    try {
      const res = await sendJson<{ email: string }>('/api/users/confirm', 'POST', { token });
      router.push(`/sign-in?confirmed=1&email=${encodeURIComponent(res.email)}`);
    } catch (e) {
      setState({ kind: 'error', message: (e as Error).message });
    }
  }
  return (
    <div className="space-y-4">
      <p>One step left: press the button to create your Candlewise account. Then sign in with the password you chose.</p>
      <button type="button" className="btn-primary" onClick={() => void confirm()} disabled={state.kind === 'busy'}>
        {state.kind === 'busy' ? 'Creating…' : 'Create my account'}
      </button>
      {state.kind === 'error' ? (
        <p role="alert" className="field-error">
          {state.message} <Link href="/sign-up">Sign up again</Link>
        </p>
      ) : null}
    </div>
  );
}
