import { NextResponse } from 'next/server';
import { z } from 'zod';
import { route } from '@/lib/http/route';
import { confirmSignUp } from '@/lib/data/sign-ups';

// The second half of sign-up: the token from the e-mailed link creates the account. No sign-in
// (the token is the proof); the page at /sign-up/confirm asks for one press first, because mail
// scanners open links too.
const confirmSchema = z.object({ token: z.string({ error: 'The link is incomplete.' }).min(20, { error: 'The link is incomplete.' }).max(200) });

export const POST = route({ body: confirmSchema }, async (_req, _ctx, { body }) => {
  const result = await confirmSignUp(body.token);
  return NextResponse.json(result);
});
