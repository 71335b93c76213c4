import { createSerwistRoute } from '@serwist/turbopack';

// The service worker, bundled from app/sw.ts and served as /serwist/sw.js (Turbopack takes no
// webpack plugins, so Serwist builds it in a static route at `next build`).

export const { dynamic, dynamicParams, revalidate, generateStaticParams, GET } = createSerwistRoute({
  swSrc: 'app/sw.ts',
  useNativeEsbuild: true,
  // The wizard page is not precached: a copy fetched at install time would be served with whoever
  // was (or was not) signed in then. It is cached network-first when visited (app/sw.ts).
});
