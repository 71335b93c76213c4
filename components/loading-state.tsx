export function LoadingState() {
  return (
    <div role="status" aria-live="polite" className="flex items-center gap-3 py-10 text-stone-700">
      <span className="h-4 w-4 animate-spin rounded-full border-2 border-moss-600 border-t-transparent" aria-hidden />
      Loading…
    </div>
  );
}
