'use client';
import dynamic from 'next/dynamic';

// The registration code (the service worker's window library) loads after the page is
// interactive, in its own chunk, instead of in every page's first download.
const Registrar = dynamic(() => import('./service-worker-registrar'), { ssr: false });

/** Registers the service worker in production builds; a reload on reconnect would lose a wizard run. */
export function ServiceWorker({ children }: { children: React.ReactNode }) {
  return (
    <>
      {children}
      <Registrar />
    </>
  );
}
