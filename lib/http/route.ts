import 'server-only';
import { NextResponse, type NextRequest } from 'next/server';
import type { z } from 'zod';
import { AppError, isAppError } from '@/lib/errors';
import { fieldErrorsOf } from '@/lib/validation/fields';
import { env } from '@/lib/env';

const MUTATING = new Set(['POST', 'PUT', 'PATCH', 'DELETE']);

/** The origins this server answers as: the configured URL and the Host the request came to. */
function ownOrigins(req: Request): Set<string> {
  const set = new Set<string>([new URL(env.NEXTAUTH_URL).origin]);
  const host = req.headers.get('host');
  if (host) {
    const proto = req.headers.get('x-forwarded-proto') ?? new URL(req.url).protocol.replace(':', '');
    set.add(`${proto}://${host}`);
  }
  return set;
}

/**
 * Refuse cross-site writes. Browsers send Origin on every cross-origin POST; an absent Origin
 * is a non-browser client, which carries no victim's cookies. `Origin: null` (sandboxed frames,
 * some redirects) is refused, as is any Sec-Fetch-Site of `cross-site`.
 */
export function assertSameOrigin(req: Request) {
  if (!MUTATING.has(req.method)) return;
  const origin = req.headers.get('origin');
  const fetchSite = req.headers.get('sec-fetch-site');
  if (fetchSite === 'cross-site') throw new AppError('forbidden:origin', 'Cross-site requests are refused.');
  if (origin === null) return;
  if (origin === 'null' || !ownOrigins(req).has(origin)) {
    throw new AppError('forbidden:origin', 'Cross-site requests are refused.');
  }
}

export function errorResponse(e: unknown): NextResponse {
  if (isAppError(e)) return NextResponse.json(e.toBody(), { status: e.status });
  // Database and other unexpected errors are logged, never echoed.
  console.error('[candlewise] unexpected error', e);
  return NextResponse.json({ error: { code: 'internal', message: 'Something went wrong on our side.' } }, { status: 500 });
}

type Ctx<P> = { params: Promise<P> };

/** Wrap a route handler: same-origin check for writes, and one error shape for every failure. */
export function route<P = Record<string, never>>(
  fn: (req: NextRequest, ctx: Ctx<P>) => Promise<Response>,
) {
  return async (req: NextRequest, ctx: Ctx<P>) => {
    try {
      assertSameOrigin(req);
      return await fn(req, ctx);
    } catch (e) {
      return errorResponse(e);
    }
  };
}

/** Read and validate a JSON body. Malformed JSON → 400; a valid document that fails the schema → `invalidStatus`. */
export async function parseJson<S extends z.ZodType>(
  req: Request,
  schema: S,
  opts: { invalidStatus?: 400 | 422; maxBytes?: number } = {},
): Promise<z.infer<S>> {
  const type = req.headers.get('content-type') ?? '';
  if (!/^application\/(.+\+)?json\b/i.test(type)) {
    throw new AppError('unsupported_media_type:body', 'Send the body as application/json.');
  }
  const text = await req.text();
  if (text.length > (opts.maxBytes ?? 1_000_000)) throw new AppError('payload_too_large:body');
  let data: unknown;
  try {
    data = JSON.parse(text);
  } catch {
    throw new AppError('bad_request:body', 'The body is not valid JSON.', { body: ['Malformed JSON'] });
  }
  return parseWith(schema, data, opts.invalidStatus ?? 422);
}

/**
 * The path of the first string (or key) holding a NUL character, or null. PostgreSQL text and
 * jsonb cannot store U+0000, so such input is refused here rather than failing in the database.
 * Iterative, so a deeply nested document cannot exhaust the stack.
 */
export function findNul(data: unknown): string | null {
  const stack: [unknown, string][] = [[data, '']];
  while (stack.length) {
    const [v, at] = stack.pop()!;
    if (typeof v === 'string') {
      if (v.includes('\u0000')) return at || 'body';
    } else if (Array.isArray(v)) {
      for (let i = v.length - 1; i >= 0; i--) stack.push([v[i], at ? `${at}.${i}` : String(i)]);
    } else if (v !== null && typeof v === 'object') {
      for (const [k, x] of Object.entries(v)) {
        const p = at ? `${at}.${k}` : k;
        if (k.includes('\u0000')) return p;
        stack.push([x, p]);
      }
    }
  }
  return null;
}

export function parseWith<S extends z.ZodType>(schema: S, data: unknown, status: 400 | 422 = 422): z.infer<S> {
  const nul = findNul(data);
  if (nul !== null) {
    throw new AppError(status === 400 ? 'bad_request:fields' : 'invalid:fields', 'Some fields are not valid.', { [nul]: ['Must not contain NUL characters.'] });
  }
  const result = schema.safeParse(data);
  if (!result.success) {
    throw new AppError(status === 400 ? 'bad_request:fields' : 'invalid:fields', 'Some fields are not valid.', fieldErrorsOf(result.error));
  }
  return result.data;
}

/** Validate URL search params (always 400: the request itself is malformed). */
export function parseQuery<S extends z.ZodType>(req: Request, schema: S): z.infer<S> {
  const params = Object.fromEntries(new URL(req.url).searchParams.entries());
  return parseWith(schema, params, 400);
}
