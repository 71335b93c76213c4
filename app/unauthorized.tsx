import Link from 'next/link';

export default function Unauthorized() {
  return (
    <div className="card max-w-xl space-y-3">
      <h1 className="text-2xl">Please sign in</h1>
      <p className="text-stone-700">You need to be signed in to see this page.</p>
      <Link href="/sign-in" className="btn-primary">
        Sign in
      </Link>
    </div>
  );
}
