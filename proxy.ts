import { NextResponse, type NextRequest } from 'next/server';
import { pagePolicy } from '@/lib/http/csp';

// A fresh nonce per page request for the page policy (lib/http/csp.ts). The request carries the
// policy too, which is how Next finds the nonce for its own scripts. API routes are not matched:
// Next buffers the body of every request a proxy sees, which would defeat the body cap of
// route(); their strict policy comes from next.config.ts.
export function proxy(request: NextRequest) {
  const nonce = btoa(String.fromCharCode(...crypto.getRandomValues(new Uint8Array(16))));
  const policy = pagePolicy(nonce, process.env.NODE_ENV !== 'production');
  const headers = new Headers(request.headers);
  headers.set('x-nonce', nonce);
  headers.set('content-security-policy', policy);
  const response = NextResponse.next({ request: { headers } });
  response.headers.set('content-security-policy', policy);
  return response;
}

export const config = {
  // Pages only: not the API, and not built assets (never documents, served before routing).
  matcher: [{ source: '/((?!api/|api$|_next/static|_next/image).*)' }],
};
