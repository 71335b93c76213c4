'use client';
import { signOut } from 'next-auth/react';
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
        void signOut({ callbackUrl: '/' });
      }}
    >
      {pending ? 'Signing out…' : 'Sign out'}
    </button>
  );
}
