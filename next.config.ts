import type { NextConfig } from 'next';
import { withSerwist } from '@serwist/turbopack';

const isProd = process.env.NODE_ENV === 'production';

// The CSP allows inline scripts because Next's App Router streams inline bootstrap scripts;
// everything else is same-origin only and framing is refused.
const csp = [
  "default-src 'self'",
  "script-src 'self' 'unsafe-inline'" + (isProd ? '' : " 'unsafe-eval'"),
  "style-src 'self' 'unsafe-inline'",
  "img-src 'self' data: blob:",
  "font-src 'self'",
  "connect-src 'self'",
  "object-src 'none'",
  "base-uri 'self'",
  "form-action 'self'",
  "frame-ancestors 'none'",
].join('; ');

const nextConfig: NextConfig = {
  // PGlite ships wasm and must be loaded by Node at run time, not bundled.
  serverExternalPackages: ['@electric-sql/pglite', 'sharp', 'smtp-server', 'mailparser', 'nodemailer'],
  poweredByHeader: false,
  typedRoutes: false,
  // forbidden() and unauthorized() render real 403/401 pages.
  experimental: { authInterrupts: true },
  async headers() {
    return [
      // The worker may control the whole site though it is served from /serwist/.
      { source: '/serwist/:path*', headers: [{ key: 'Service-Worker-Allowed', value: '/' }, { key: 'Cache-Control', value: 'no-cache' }] },
      {
        source: '/:path*',
        headers: [
          { key: 'Content-Security-Policy', value: csp },
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
