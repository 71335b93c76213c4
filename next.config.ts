import type { NextConfig } from 'next';

// The Content-Security-Policy is set per request by proxy.ts (a nonce for pages, a strict
// policy for API answers); the headers here hold for every answer, built assets included.

const nextConfig: NextConfig = {
  // PGlite ships wasm and must be loaded by Node at run time, not bundled.
  serverExternalPackages: ['@electric-sql/pglite', 'sharp', 'smtp-server', 'mailparser', 'nodemailer'],
  poweredByHeader: false,
  typedRoutes: false,
  // forbidden() and unauthorized() render real 403/401 pages.
  experimental: { authInterrupts: true },
  async headers() {
    return [
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

export default nextConfig;
