import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { listReminderRuns } from '@/lib/data/reminders';

// The latest reminder runs, newest first, with their counts.
export const GET = route({ auth: 'admin', subject: 'reminders' }, async (_req, _ctx, { user }) => NextResponse.json({ items: await listReminderRuns(user) }));
