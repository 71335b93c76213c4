'use client';
import { SerwistProvider } from '@serwist/turbopack/react';

export default function ServiceWorkerRegistrar() {
  return (
    <SerwistProvider swUrl="/serwist/sw.js" disable={process.env.NODE_ENV !== 'production'} reloadOnOnline={false} options={{ scope: '/' }}>
      {null}
    </SerwistProvider>
  );
}
