import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { settingsSchema } from '@/lib/validation/auth';
import { getClubSettings, updateClubSettings } from '@/lib/data/settings';
import { requireUser } from '@/lib/auth/session';

export const GET = route(async () => NextResponse.json({ settings: await getClubSettings() }));

export const PUT = route(async (req) => {
  const input = await parseJson(req, settingsSchema);
  const actor = await requireUser();
  return NextResponse.json({ settings: await updateClubSettings(actor, input) });
});
