import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { profilePatchSchema } from '@/lib/validation/auth';
import { getProfile, updateProfile } from '@/lib/data/users';
import { requireUser } from '@/lib/auth/session';

export const GET = route(async () => {
  const actor = await requireUser();
  return NextResponse.json({ user: await getProfile(actor) });
});

export const PATCH = route(async (req) => {
  const actor = await requireUser();
  const patch = await parseJson(req, profilePatchSchema);
  return NextResponse.json({ user: await updateProfile(actor, patch) });
});
