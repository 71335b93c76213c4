import type { Metadata } from 'next';
import { peekUnsubscribeList } from '@/lib/mail/unsubscribe';
import { UnsubscribeForm } from './unsubscribe-form';

export const metadata: Metadata = { title: 'Stop these e-mails', robots: { index: false } };

const titles = { digest: 'Stop the meeting-notes e-mails', reminders: 'Stop the weekly reminders' } as const;

// Opening the link changes nothing by itself (mail scanners open links too): the member
// confirms with one button, signed in or not. The heading follows the list the token names;
// the server checks the token's signature when the member confirms.
export default async function UnsubscribePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const sp = await searchParams;
  const token = typeof sp.token === 'string' ? sp.token : '';
  const list = token ? peekUnsubscribeList(token) : 'digest';
  return (
    <div className="card mx-auto max-w-xl space-y-4">
      <h1 className="page-title">{titles[list]}</h1>
      {token ? (
        <UnsubscribeForm token={token} list={list} />
      ) : (
        <p role="alert">This link is incomplete. Open the link from the e-mail again, or sign in and turn the e-mails off on your profile page.</p>
      )}
    </div>
  );
}
