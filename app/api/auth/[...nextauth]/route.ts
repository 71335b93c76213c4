import NextAuth from 'next-auth';
import { NextRequest, NextResponse } from 'next/server';
import { authOptions } from '@/lib/auth/options';
import { clientIp, emailKey, isSignInBlocked, takeToken } from '@/lib/auth/rate-limit';
import { env } from '@/lib/env';
import { errorResponse } from '@/lib/http/route';
import { readBodyCapped } from '@/lib/http/body';

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

/** next-auth's own bodies are a CSRF token, an e-mail address, a password and a URL or two. */
export const MAX_AUTH_BODY_BYTES = 16 * 1024;

// Sign-in link requests, per address and per client (on top of next-auth's own checks): enough
// for a lost mail or two, not for flooding someone's inbox.
export const MAX_LINKS_PER_EMAIL = 3;
export const MAX_LINKS_PER_IP = 30;
const LINK_WINDOW_MS = 15 * 60_000;

/** The body as next-auth itself reads it (utils.getBody): JSON or a URL-encoded form, else nothing. */
function parseLikeNextAuth(type: string, bytes: Uint8Array): Record<string, unknown> | undefined {
  const text = new TextDecoder().decode(bytes);
  if (type.includes('application/json')) {
    try {
      const v: unknown = JSON.parse(text);
      return v !== null && typeof v === 'object' ? (v as Record<string, unknown>) : {};
    } catch {
      return undefined;
    }
  }
  if (type.includes('application/x-www-form-urlencoded')) return Object.fromEntries(new URLSearchParams(text));
  return undefined;
}

function limited(message: string, error: string) {
  return NextResponse.json(
    { error: { code: 'rate_limited:sign-in', message }, url: `${env.NEXTAUTH_URL}/sign-in?error=${error}` },
    { status: 429, headers: { 'Retry-After': '60' } },
  );
}

export async function GET(req: NextRequest, ctx: Ctx) {
  return handler(req, ctx);
}

export async function POST(req: NextRequest, ctx: Ctx) {
  let bytes: Uint8Array;
  try {
    bytes = await readBodyCapped(req, MAX_AUTH_BODY_BYTES);
  } catch (e) {
    return errorResponse(e);
  }
  const { nextauth = [] } = await ctx.params;
  // next-auth routes on the first two segments only (action, provider) and ignores the rest, so
  // `callback/credentials/anything` reaches the credentials check too: match the way it does.
  const [action, provider] = nextauth;
  const body = parseLikeNextAuth(req.headers.get('content-type') ?? '', bytes);
  const ip = clientIp(req.headers);
  if (action === 'callback' && provider === 'credentials') {
    if (await isSignInBlocked(emailKey(body?.email), ip)) {
      return limited('Too many failed sign-ins. Wait a minute and try again.', 'RateLimited');
    }
  }
  if (action === 'signin' && provider === 'email') {
    // Counted for known and unknown addresses alike, so a refusal says nothing about membership.
    const key = emailKey(body?.email);
    const perIp = await takeToken(`link-ip:${ip}`, MAX_LINKS_PER_IP, LINK_WINDOW_MS);
    const perEmail = key ? await takeToken(`link-e:${key}`, MAX_LINKS_PER_EMAIL, LINK_WINDOW_MS) : true;
    if (!perIp || !perEmail) return limited('Too many sign-in links asked for. Wait a few minutes and try again.', 'RateLimited');
  }
  // Hand next-auth the very bytes we counted and read.
  const replay = new NextRequest(req.url, {
    method: req.method,
    headers: req.headers,
    body: bytes.byteLength ? (bytes as BodyInit) : undefined,
  });
  return handler(replay, ctx);
}
