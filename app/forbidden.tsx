import Link from 'next/link';

export default function Forbidden() {
  return (
    <div className="card max-w-xl space-y-3" data-testid="forbidden">
      <h1 className="text-2xl">Not for your role</h1>
      <p className="text-stone-700">This page belongs to another club role. Ask an administrator if you need it.</p>
      <Link href="/" className="btn-secondary">
        Back to the start
      </Link>
    </div>
  );
}
