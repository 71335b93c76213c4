import { NextResponse } from 'next/server';
import { z } from 'zod';
import { parseWith, route } from '@/lib/http/route';
import { unsubscribeWithToken } from '@/lib/data/digests';

// Turns the meeting-notes e-mail or the weekly reminder off for the member the signed token names. No sign-in: the
// token is the proof. Also the one-click target of the List-Unsubscribe header (RFC 8058),
// which mail providers POST to with the token in the query.
const tokenSchema = z.object({ token: z.string().min(10, { error: 'The link is incomplete.' }).max(600) });

export const POST = route(async (req) => {
  const fromQuery = new URL(req.url).searchParams.get('token');
  let token: unknown = fromQuery;
  if (!fromQuery && /^application\/json\b/i.test(req.headers.get('content-type') ?? '')) {
    // Any JSON may arrive here (null, a number, an array): only an object can carry the token.
    const body: unknown = await req.json().catch(() => null);
    token = body !== null && typeof body === 'object' ? (body as { token?: unknown }).token : undefined;
  }
  const input = parseWith(tokenSchema, { token }, 400);
  const { email, list } = await unsubscribeWithToken(input.token);
  return NextResponse.json({ ok: true, email, list });
});
