import type { NextConfig } from 'next';
import { API_POLICY } from './lib/http/csp';
import { withSerwist } from '@serwist/turbopack';

// The page Content-Security-Policy is set per request by proxy.ts (with a nonce); API answers get
// the strict API policy here. The other headers hold for every answer, built assets included.

const nextConfig: NextConfig = {
  // PGlite ships wasm and must be loaded by Node at run time, not bundled.
  serverExternalPackages: ['@electric-sql/pglite', 'sharp', 'smtp-server', 'mailparser', 'nodemailer'],
  poweredByHeader: false,
  typedRoutes: false,
  // forbidden() and unauthorized() render real 403/401 pages.
  experimental: { authInterrupts: true },
  async headers() {
    return [
      { source: '/api/:path*', headers: [{ key: 'Content-Security-Policy', value: API_POLICY }] },
      // The worker may control the whole site though it is served from /serwist/.
      {
        source: '/serwist/:path*',
        headers: [
          { key: 'Service-Worker-Allowed', value: '/' },
          { key: 'Cache-Control', value: 'no-cache' },
        ],
      },
      {
        source: '/:path*',
        headers: [
          { key: 'X-Content-Type-Options', value: 'nosniff' },
          { key: 'Referrer-Policy', value: 'strict-origin-when-cross-origin' },
          { key: 'X-Frame-Options', value: 'DENY' },
          { key: 'Permissions-Policy', value: 'camera=(), microphone=(), geolocation=(self)' },
        ],
      },
    ];
  },
};

export default withSerwist(nextConfig);
