'use client';
import { useState } from 'react';
import Link from 'next/link';
import { sendJson } from '@/components/fetcher';

const wording = {
  digest: {
    done: (email: string) => `Done: no more meeting notes will be e-mailed to ${email}.`,
    about:
      'The club’s librarian sends meeting notes by e-mail to members who asked for them. Press the button to stop them; nothing else about your account changes.',
  },
  reminders: {
    done: (email: string) => `Done: no more weekly reminders will be e-mailed to ${email}.`,
    about:
      'Candlewise e-mails a weekly list of the tasks due on your trees to members who asked for it. Press the button to stop it; nothing else about your account changes.',
  },
} as const;

export function UnsubscribeForm({ token, list }: { token: string; list: keyof typeof wording }) {
  const [state, setState] = useState<{ kind: 'idle' | 'busy' } | { kind: 'done'; email: string } | { kind: 'error'; message: string }>({ kind: 'idle' });
  async function confirm() {
    setState({ kind: 'busy' });
    try {
      const res = await sendJson<{ email: string }>('/api/unsubscribe', 'POST', { token });
      setState({ kind: 'done', email: res.email });
    } catch (e) {
      setState({ kind: 'error', message: (e as Error).message });
    }
  }
  if (state.kind === 'done') {
    return (
      <div role="status" className="space-y-2" data-testid="unsubscribed">
        <p>{wording[list].done(state.email)}</p>
        <p className="text-stone-700">
          Changed your mind? Turn them back on from your <Link href="/profile">profile</Link>.
        </p>
      </div>
    );
  }
  return (
    <div className="space-y-4">
      <p>{wording[list].about}</p>
      <button type="button" className="btn-primary" onClick={() => void confirm()} disabled={state.kind === 'busy'}>
        Stop these e-mails
      </button>
      {state.kind === 'error' ? (
        <p role="alert" className="field-error">
          {state.message}
        </p>
      ) : null}
    </div>
  );
}
