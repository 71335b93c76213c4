import 'server-only';
import { NextRequest, NextResponse } from 'next/server';
import type { z } from 'zod';
import { AppError, isAppError } from '@/lib/errors';
import { fieldErrorsOf } from '@/lib/validation/fields';
import { env } from '@/lib/env';
import type { Role } from '@/db/schema';
import { getCurrentUser, type SessionUser } from '@/lib/auth/session';
import { hasRole } from '@/lib/auth/roles';
import { DEFAULT_MAX_BODY_BYTES, readBodyCapped } from './body';

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
function assertSameOrigin(req: Request) {
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

/** Who may call: a role (a member is any signed-in user), or `public` for no session at all. */
type RouteAuth = Role | 'public';

export interface RouteOptions {
  /** Checked after the origin and the body cap, before any validation: 401/403 come before 422. */
  auth?: RouteAuth;
  /** Subject of the 401/403 codes (`forbidden:<subject>`). Default `resource`. */
  subject?: string;
  /** Path params; a value that fails is a 404 (`not_found:<notFound>`), never a 400 or 422. */
  params?: z.ZodType;
  notFound?: string;
  /** URL query; a failure is a 400 naming the field. */
  query?: z.ZodType;
  /** JSON body; a failure is `invalidStatus` (422, or 400 where a contract says so). */
  body?: z.ZodType;
  invalidStatus?: 400 | 422;
  /** The body cap in bytes (default DEFAULT_MAX_BODY_BYTES). Over it: 413, the rest unread. */
  maxBytes?: number;
  /** How a 413 names what was too large (default: subject and field `body`). */
  tooLarge?: { subject?: string; field?: string; message?: string };
}

type Infer<T, Else> = T extends z.ZodType ? z.infer<T> : Else;

interface RouteInput<O extends RouteOptions, P> {
  /** The session user, read once for this request (null only on `public` routes or without `auth`). */
  user: O['auth'] extends Role ? SessionUser : SessionUser | null;
  params: Infer<O['params'], P>;
  query: Infer<O['query'], undefined>;
  body: Infer<O['body'], undefined>;
}

type PlainHandler<P> = (req: NextRequest, ctx: Ctx<P>) => Promise<Response>;
type OptionHandler<O extends RouteOptions, P> = (req: NextRequest, ctx: Ctx<P>, input: RouteInput<O, P>) => Promise<Response>;

/** Read the body under the cap and hand the handler a request that replays exactly those bytes. */
async function capBody(req: NextRequest, maxBytes: number, tooLarge: RouteOptions['tooLarge']): Promise<NextRequest> {
  if (req.body === null || req.method === 'GET' || req.method === 'HEAD') return req;
  const bytes = await readBodyCapped(req, maxBytes, tooLarge ?? { field: 'body' });
  return new NextRequest(req.url, { method: req.method, headers: req.headers, body: bytes.byteLength ? (bytes as BodyInit) : undefined });
}

/**
 * Wrap a route handler. Every request runs the same steps in one fixed order:
 * origin check (writes) → body cap → session → role → params → query → body → handler,
 * and every failure leaves in one error shape.
 *
 * `route(fn)` keeps the older form (the handler checks its own session and input, but the origin
 * check and the 1 MB body cap still apply); `route(options, fn)` does all of it here and passes
 * `{ user, params, query, body }` as the handler's third argument.
 */
export function route<P = Record<string, never>>(fn: PlainHandler<P>): PlainHandler<P>;
export function route<O extends RouteOptions, P = Record<string, string | string[]>>(opts: O, fn: OptionHandler<O, P>): PlainHandler<P>;
export function route<O extends RouteOptions, P>(a: PlainHandler<P> | O, b?: OptionHandler<O, P>): PlainHandler<P> {
  const opts: RouteOptions = typeof a === 'function' ? {} : a;
  const fn = (typeof a === 'function' ? a : b) as OptionHandler<O, P>;
  return async (req: NextRequest, ctx: Ctx<P>) => {
    try {
      assertSameOrigin(req);
      const capped = await capBody(req, opts.maxBytes ?? DEFAULT_MAX_BODY_BYTES, opts.tooLarge);
      let user: SessionUser | null = null;
      if (opts.auth && opts.auth !== 'public') {
        user = await getCurrentUser();
        const subject = opts.subject ?? 'resource';
        if (!user) throw new AppError('unauthorized:auth');
        if (!hasRole(user.role, opts.auth)) throw new AppError(`forbidden:${subject}`);
      }
      let params = (await ctx.params) as unknown;
      if (opts.params) {
        const r = opts.params.safeParse(params);
        if (!r.success) throw new AppError(`not_found:${opts.notFound ?? 'resource'}`, 'Not found.');
        params = r.data;
      }
      const query = opts.query ? parseQuery(capped, opts.query) : undefined;
      const body = opts.body ? await parseJson(capped, opts.body, { invalidStatus: opts.invalidStatus, maxBytes: opts.maxBytes }) : undefined;
      const input = { user, params, query, body } as RouteInput<O, P>;
      return await fn(capped, { params: Promise.resolve(params as P) }, input);
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
  const text = new TextDecoder().decode(await readBodyCapped(req, opts.maxBytes ?? DEFAULT_MAX_BODY_BYTES));
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
