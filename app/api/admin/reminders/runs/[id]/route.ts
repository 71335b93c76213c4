import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { getReminderRun } from '@/lib/data/reminders';
import { reminderRunParams } from '@/lib/validation/reminders';

// One reminder run's progress: how many members it looks at, sent, skipped, failed, still pending.
export const GET = route({ auth: 'admin', subject: 'reminders', params: reminderRunParams, notFound: 'reminder_run' }, async (_req, _ctx, { user, params }) =>
  NextResponse.json({ run: await getReminderRun(user, params.id) }),
);
