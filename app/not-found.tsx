import Link from 'next/link';

export default function NotFound() {
  return (
    <div className="card max-w-xl space-y-3">
      <h1 className="text-2xl">Not found</h1>
      <p className="text-stone-700">There is nothing here, or it is not yours to see.</p>
      <Link href="/" className="btn-secondary">
        Back to the start
      </Link>
    </div>
  );
}
