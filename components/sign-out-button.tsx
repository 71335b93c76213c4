'use client';
import { useState } from 'react';

export function SignOutButton() {
  const [pending, setPending] = useState(false);
  return (
    <button
      type="button"
      className="min-h-target rounded-lg border border-white/60 px-3 text-white hover:bg-moss-800"
      disabled={pending}
      onClick={() => {
        setPending(true);
        // Loaded on the press, not with every page: public pages carry no sign-in client code.
        void import('next-auth/react').then(({ signOut }) => signOut({ callbackUrl: '/' }));
      }}
    >
      {pending ? 'Signing out…' : 'Sign out'}
    </button>
  );
}
