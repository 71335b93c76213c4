import { NextResponse } from 'next/server';
import { z } from 'zod';
import { parseJson, parseQuery, route } from '@/lib/http/route';
import { signUpSchema } from '@/lib/validation/auth';
import { createMember, listUsers } from '@/lib/data/users';
import { requireUser } from '@/lib/auth/session';

// Sign-up: public; always creates a member.
export const POST = route(async (req) => {
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
