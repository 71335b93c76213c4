import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { settingsSchema } from '@/lib/validation/auth';
import { getClubSettings, updateClubSettings } from '@/lib/data/settings';

export const GET = route(async () => NextResponse.json({ settings: await getClubSettings() }));

// Administrators only: the role is checked before the body is looked at.
export const PUT = route({ auth: 'admin', subject: 'settings', body: settingsSchema }, async (_req, _ctx, { user, body }) =>
  NextResponse.json({ settings: await updateClubSettings(user, body) }),
);
