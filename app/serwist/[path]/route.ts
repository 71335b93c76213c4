import { spawnSync } from 'node:child_process';
import { createSerwistRoute } from '@serwist/turbopack';

// The service worker, bundled from app/sw.ts and served as /serwist/sw.js (Turbopack takes no
// webpack plugins, so Serwist builds it in a static route at `next build`).
const revision = spawnSync('git', ['rev-parse', 'HEAD'], { encoding: 'utf-8' }).stdout?.trim() || String(Date.now());

export const { dynamic, dynamicParams, revalidate, generateStaticParams, GET } = createSerwistRoute({
  swSrc: 'app/sw.ts',
  useNativeEsbuild: true,
  // The wizard page itself, so a phone that has opened Candlewise once can ask with no signal.
  additionalPrecacheEntries: [{ url: '/ask', revision }],
});
