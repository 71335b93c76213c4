import { NextResponse } from 'next/server';
import { z } from 'zod';
import { parseJson, parseQuery, route } from '@/lib/http/route';
import { signUpSchema } from '@/lib/validation/auth';
import { listUsers } from '@/lib/data/users';
import { queueSignUp } from '@/lib/data/sign-ups';
import { requireUser } from '@/lib/auth/session';
import { clientIp, takeToken } from '@/lib/auth/rate-limit';
import { AppError } from '@/lib/errors';
import { env } from '@/lib/env';

// Sign-up: public. The answer is 202 and the same words for a new address and one that has an
// account, sent before the address is looked up; the owner of the address learns by e-mail
// what follows (a link that creates the account, or a note that they have one already).
export const POST = route(async (req) => {
  // A handful of sign-ups per client and hour: enough for a family on one connection.
  if (!(await takeToken(`signup-ip:${clientIp(req.headers)}`, env.SIGNUPS_PER_CLIENT_PER_HOUR, 60 * 60_000))) {
    throw new AppError('rate_limited:sign-up', 'Too many sign-ups from here. Try again in an hour.');
  }
  const input = await parseJson(req, signUpSchema);
  queueSignUp(input);
  return NextResponse.json({ status: 'pending', email: input.email, message: `Check your e-mail: we sent the next step to ${input.email}.` }, { status: 202 });
});

const listQuery = z.object({
  q: z.string().max(100).optional(),
  sort: z.enum(['name', 'email', 'role', 'createdAt']).optional(),
  dir: z.enum(['asc', 'desc']).optional(),
});

export const GET = route(async (req) => {
  const actor = await requireUser();
  const query = parseQuery(req, listQuery);
  return NextResponse.json({ items: await listUsers(actor, query) });
});
