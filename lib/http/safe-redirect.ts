// Where to go after sign-in. Only a path on our own origin is accepted: the candidate is parsed
// as a URL against the own origin (the way a browser resolves it), and kept only when the result
// is still on that origin. Backslashes, tabs and newlines (which browsers strip or read as `/`),
// protocol-relative and encoded forms all resolve elsewhere or are refused before parsing.

const BASE = 'http://candlewise.invalid';

/** A same-origin path (with query and hash) for `candidate`, or `fallback`. */
export function safeCallbackPath(candidate: unknown, ownOrigin: string = BASE, fallback = '/'): string {
  if (typeof candidate !== 'string' || candidate.length === 0 || candidate.length > 2000) return fallback;
  // Control characters and backslashes have no place in a path we hand out; browsers drop
  // tab/CR/LF and turn `\` into `/`, which is how `/\evil.example` and `/%09/…` escaped.
  if (/[\u0000-\u001f\u007f\\]/.test(candidate)) return fallback;
  let decoded = candidate;
  try {
    // One decode pass: `/%2F/evil.example` or `/%5Cevil.example` must not become a host later.
    decoded = decodeURIComponent(candidate);
  } catch {
    return fallback;
  }
  if (/[\u0000-\u001f\u007f\\]/.test(decoded) || decoded.startsWith('//')) return fallback;
  let origin: string;
  try {
    origin = new URL(ownOrigin).origin;
  } catch {
    origin = BASE;
  }
  let url: URL;
  try {
    url = new URL(candidate, origin);
  } catch {
    return fallback;
  }
  if (url.origin !== origin) return fallback;
  if (!candidate.startsWith('/') && !candidate.startsWith(origin + '/') && candidate !== origin) return fallback;
  const path = `${url.pathname}${url.search}${url.hash}`;
  // The path itself must not read as protocol-relative once someone re-resolves it.
  if (!path.startsWith('/') || path.startsWith('//')) return fallback;
  return path;
}
