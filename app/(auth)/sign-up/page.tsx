import type { Metadata } from 'next';
import Link from 'next/link';
import { SignUpForm } from './_components/sign-up-form';

export const metadata: Metadata = { title: 'Create an account' };

export default function SignUpPage() {
  return (
    <div className="mx-auto max-w-md space-y-6">
      <h1 className="page-title">Create an account</h1>
      <p className="text-stone-700">Members ask about their shoots, keep their trees and save their answers.</p>
      <SignUpForm />
      <p className="text-stone-700">
        Already a member? <Link href="/sign-in">Sign in</Link>.
      </p>
    </div>
  );
}
