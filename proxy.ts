import { NextResponse, type NextRequest } from 'next/server';
import { API_POLICY, pagePolicy } from '@/lib/http/csp';

// A fresh nonce per request for the page policy (lib/http/csp.ts); API answers get the strict
// policy. The request carries the policy too, which is how Next finds the nonce for its scripts.
export function proxy(request: NextRequest) {
  const isApi = request.nextUrl.pathname === '/api' || request.nextUrl.pathname.startsWith('/api/');
  const nonce = btoa(String.fromCharCode(...crypto.getRandomValues(new Uint8Array(16))));
  const policy = isApi ? API_POLICY : pagePolicy(nonce, process.env.NODE_ENV !== 'production');
  const headers = new Headers(request.headers);
  if (!isApi) {
    headers.set('x-nonce', nonce);
    headers.set('content-security-policy', policy);
  }
  const response = NextResponse.next({ request: { headers } });
  response.headers.set('content-security-policy', policy);
  return response;
}

export const config = {
  // Not for built assets: they are never documents, and Next serves them before routing.
  matcher: [{ source: '/((?!_next/static|_next/image).*)' }],
};
