'use client';
import { useSyncExternalStore } from 'react';
import { isOffline, subscribeConnectivity } from './connectivity';

/** False while there is no connection to Candlewise (components/offline/connectivity.ts); true on the server, so nothing flashes. */
export function useOnline(): boolean {
  return useSyncExternalStore(
    subscribeConnectivity,
    () => !isOffline(),
    () => true,
  );
}

/** Says plainly what works with no signal and what does not. */
export function OfflineBanner() {
  const online = useOnline();
  if (online) return null;
  return (
    <div role="status" data-testid="offline-banner" className="no-print border-b-2 border-sun-500 bg-sun-100 px-4 py-2 text-stone-900">
      <p className="mx-auto max-w-5xl">
        <strong>No connection.</strong> The wizard still works and keeps saved answers on this phone until you are back online. Sharing, photos and notes need a
        connection.
      </p>
    </div>
  );
}
