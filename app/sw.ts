import { defaultCache } from '@serwist/turbopack/worker';
import { NetworkFirst, Serwist, type PrecacheEntry, type SerwistGlobalConfig } from 'serwist';

// Candlewise's service worker: Next's assets precached, pages network-first, and the wizard page
// (cached network-first when visited) answered from that copy whatever its query when there is no signal.

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}

declare const self: WorkerGlobalScope;

const askPage = new NetworkFirst({
  cacheName: 'ask-page',
  networkTimeoutSeconds: 5,
  plugins: [{ cacheKeyWillBeUsed: async ({ request }) => new URL('/ask', request.url).href }],
});

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  skipWaiting: true,
  clientsClaim: true,
  navigationPreload: false,
  runtimeCaching: [
    { matcher: ({ request, url }) => request.mode === 'navigate' && url.pathname === '/ask', handler: askPage },
    ...defaultCache,
  ],
});

serwist.addEventListeners();
