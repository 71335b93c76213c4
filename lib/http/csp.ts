// The Content-Security-Policy of every answer: pages per request by proxy.ts, API answers by
// next.config.ts.
// Pages: scripts only from our origin or carrying this request's nonce (Next puts the nonce on
// its own bootstrap scripts when it finds it in the request's policy); no 'unsafe-inline' for
// scripts. API answers: nothing in them is meant to run as a document, so nothing may (the
// photo route's `default-src 'none'; sandbox` is this policy's subset, so it is what is sent).

export function pagePolicy(nonce: string, dev = false): string {
  return [
    "default-src 'self'",
    `script-src 'self' 'nonce-${nonce}' 'strict-dynamic'${dev ? " 'unsafe-eval'" : ''}`,
    "style-src 'self' 'unsafe-inline'",
    "img-src 'self' data: blob:",
    "font-src 'self'",
    "connect-src 'self'",
    "object-src 'none'",
    "base-uri 'self'",
    "form-action 'self'",
    "frame-ancestors 'none'",
  ].join('; ');
}

export const API_POLICY = ["default-src 'none'", "object-src 'none'", "base-uri 'none'", "form-action 'none'", "frame-ancestors 'none'", 'sandbox'].join('; ');
