'use client';

export default function ErrorPage({ error, reset }: { error: Error & { digest?: string }; reset: () => void }) {
  return (
    <div className="card max-w-xl space-y-3" role="alert">
      <h1 className="text-2xl">Something went wrong</h1>
      <p className="text-stone-700">The page could not be shown. Nothing you entered was lost on our side; try again.</p>
      {error.digest ? <p className="text-sm text-stone-600">Reference: {error.digest}</p> : null}
      <button type="button" className="btn-primary" onClick={reset}>
        Try again
      </button>
    </div>
  );
}
