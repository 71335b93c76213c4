import { LoadingState } from '@/components/loading-state';

// Only the public list sits under this boundary: pages that guard with requirePageUser /
// requirePageRole or call notFound() must not stream behind a loading state (it would turn
// their redirect, 403 or 404 into a 200).
export default function Loading() {
  return <LoadingState />;
}
