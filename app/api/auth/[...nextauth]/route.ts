import NextAuth from 'next-auth';
import { NextResponse, type NextRequest } from 'next/server';
import { authOptions } from '@/lib/auth/options';
import { clientIp, isSignInBlocked } from '@/lib/auth/rate-limit';
import { env } from '@/lib/env';

const handler = NextAuth(authOptions);

type Ctx = { params: Promise<{ nextauth: string[] }> };

export async function GET(req: NextRequest, ctx: Ctx) {
  return handler(req, ctx);
}

export async function POST(req: NextRequest, ctx: Ctx) {
  const { nextauth } = await ctx.params;
  if (nextauth.join('/') === 'callback/credentials') {
    const form = await req.clone().formData().catch(() => null);
    const email = String(form?.get('email') ?? '').trim().toLowerCase();
    if (isSignInBlocked(email, clientIp(req.headers))) {
      return NextResponse.json(
        {
          error: { code: 'rate_limited:sign-in', message: 'Too many failed sign-ins. Wait a minute and try again.' },
          url: `${env.NEXTAUTH_URL}/sign-in?error=RateLimited`,
        },
        { status: 429, headers: { 'Retry-After': '60' } },
      );
    }
  }
  return handler(req, ctx);
}
