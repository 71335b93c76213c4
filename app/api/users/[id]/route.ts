import { NextResponse } from 'next/server';
import { z } from 'zod';
import { route } from '@/lib/http/route';
import { idSchema } from '@/lib/ids';
import { userPatchSchema } from '@/lib/validation/auth';
import { updateUserByAdmin } from '@/lib/data/users';

const params = z.object({ id: idSchema('user') });

// Administrators only; a malformed id names nobody: 404, after the role check.
export const PATCH = route(
  { auth: 'admin', subject: 'users', params, notFound: 'user', body: userPatchSchema },
  async (_req, _ctx, { user, params: { id }, body }) => NextResponse.json({ user: await updateUserByAdmin(user, id, body) }),
);
