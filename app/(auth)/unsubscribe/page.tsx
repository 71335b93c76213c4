import type { Metadata } from 'next';
import { UnsubscribeForm } from './unsubscribe-form';

export const metadata: Metadata = { title: 'Stop the meeting-notes e-mails', robots: { index: false } };

// Opening the link changes nothing by itself (mail scanners open links too): the member
// confirms with one button, signed in or not.
export default async function UnsubscribePage({ searchParams }: { searchParams: Promise<Record<string, string | string[] | undefined>> }) {
  const sp = await searchParams;
  const token = typeof sp.token === 'string' ? sp.token : '';
  return (
    <div className="card mx-auto max-w-xl space-y-4">
      <h1 className="page-title">Stop the meeting-notes e-mails</h1>
      {token ? (
        <UnsubscribeForm token={token} />
      ) : (
        <p role="alert">This link is incomplete. Open the link from the e-mail again, or sign in and turn the e-mails off on your profile page.</p>
      )}
    </div>
  );
}
