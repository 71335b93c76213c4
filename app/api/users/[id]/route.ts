import { NextResponse } from 'next/server';
import { z } from 'zod';
import { parseJson, parseWith, route } from '@/lib/http/route';
import { userPatchSchema } from '@/lib/validation/auth';
import { updateUserByAdmin } from '@/lib/data/users';
import { requireUser } from '@/lib/auth/session';

const params = z.object({ id: z.string().min(1).max(64) });

export const PATCH = route<{ id: string }>(async (req, ctx) => {
  const { id } = parseWith(params, await ctx.params, 400);
  const patch = await parseJson(req, userPatchSchema);
  const actor = await requireUser();
  return NextResponse.json({ user: await updateUserByAdmin(actor, id, patch) });
});
