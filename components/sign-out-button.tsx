'use client';
import { useState } from 'react';
import { clearMemberCaches } from '@/components/offline/member';

export function SignOutButton() {
  const [pending, setPending] = useState(false);
  return (
    <button
      type="button"
      className="min-h-target rounded-lg border border-white/60 px-3 text-white hover:bg-moss-800"
      disabled={pending}
      onClick={() => {
        setPending(true);
        // What this member's pages and trees left in the offline caches goes before anyone else signs in;
        // the sign-in client loads on the press, not with every page.
        void clearMemberCaches().finally(() => import('next-auth/react').then(({ signOut }) => signOut({ callbackUrl: '/' })));
      }}
    >
      {pending ? 'Signing out…' : 'Sign out'}
    </button>
  );
}
