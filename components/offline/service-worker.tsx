'use client';
import { SerwistProvider } from '@serwist/turbopack/react';

/** Registers the service worker in production builds; a reload on reconnect would lose a wizard run. */
export function ServiceWorker({ children }: { children: React.ReactNode }) {
  return (
    <SerwistProvider swUrl="/serwist/sw.js" disable={process.env.NODE_ENV !== 'production'} reloadOnOnline={false} options={{ scope: '/' }}>
      {children}
    </SerwistProvider>
  );
}
