import { defaultCache } from '@serwist/turbopack/worker';
import { NetworkFirst, NetworkOnly, Serwist, type PrecacheEntry, type RuntimeCaching, type SerwistGlobalConfig } from 'serwist';
import { ASK_PAGE_CACHE, MEMBER_DATA_CACHE, OFFLINE_DATA_URL, WIZARD_DATA_CACHE } from '../lib/offline/cache-names';

// Candlewise's service worker: Next's assets precached; at run time, network-first, the wizard page
// (answered from that copy whatever its query when there is no signal), the published species data
// the wizard evaluates with, and the member's trees. No page is precached: a copy fetched at install
// time would carry that moment's sign-in state and a stale CSP nonce. Every other API read goes to
// the network only, so no member's answers or profile sit in a cache.

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}

declare const self: WorkerGlobalScope;

const askPage = new NetworkFirst({
  cacheName: ASK_PAGE_CACHE,
  networkTimeoutSeconds: 5,
  plugins: [{ cacheKeyWillBeUsed: async ({ request }) => new URL('/ask', request.url).href }],
});

// Only answers that worked are kept: a 401 after the session ran out must not replace the trees.
const okOnly = { cacheWillUpdate: async ({ response }: { response: Response }) => (response.status === 200 ? response : null) };

const wizardData = new NetworkFirst({ cacheName: WIZARD_DATA_CACHE, networkTimeoutSeconds: 5, plugins: [okOnly] });
const memberData = new NetworkFirst({ cacheName: MEMBER_DATA_CACHE, networkTimeoutSeconds: 5, plugins: [okOnly] });

const ours: RuntimeCaching[] = [
  { matcher: ({ request, url }) => request.mode === 'navigate' && url.pathname === '/ask', handler: askPage },
  { matcher: ({ sameOrigin, url }) => sameOrigin && url.pathname === OFFLINE_DATA_URL, method: 'GET', handler: wizardData },
  { matcher: ({ sameOrigin, url }) => sameOrigin && /^\/api\/trees(\/[A-Za-z0-9_-]+)?$/.test(url.pathname), method: 'GET', handler: memberData },
  { matcher: ({ sameOrigin, url }) => sameOrigin && url.pathname.startsWith('/api/'), handler: new NetworkOnly() },
];

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  skipWaiting: true,
  clientsClaim: true,
  navigationPreload: false,
  runtimeCaching: [...ours, ...defaultCache],
});

serwist.addEventListeners();
