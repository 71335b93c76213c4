import { NextResponse } from 'next/server';
import { z } from 'zod';
import { parseJson, parseQuery, route } from '@/lib/http/route';
import { signUpSchema } from '@/lib/validation/auth';
import { createMember, listUsers } from '@/lib/data/users';
import { requireUser } from '@/lib/auth/session';
import { clientIp, takeToken } from '@/lib/auth/rate-limit';
import { AppError } from '@/lib/errors';
import { env } from '@/lib/env';

// Sign-up: public; always creates a member.
export const POST = route(async (req) => {
  // A handful of accounts per client and hour: enough for a family on one connection.
  if (!takeToken(`signup-ip:${clientIp(req.headers)}`, env.SIGNUPS_PER_CLIENT_PER_HOUR, 60 * 60_000)) {
    throw new AppError('rate_limited:sign-up', 'Too many new accounts from here. Try again in an hour.');
  }
  const input = await parseJson(req, signUpSchema);
  const user = await createMember(input);
  return NextResponse.json({ user }, { status: 201 });
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
