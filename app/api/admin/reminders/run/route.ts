import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { startReminderRun } from '@/lib/data/reminders';
import { reminderRunSchema } from '@/lib/validation/reminders';

// Queue the weekly reminders for a week and answer at once (202); the run's progress is at
// /api/admin/reminders/runs/<id>. The body is optional: without one, this week.
export const POST = route({ auth: 'admin', subject: 'reminders' }, async (req, _ctx, { user }) => {
  const hasBody = (req.headers.get('content-length') ?? '') !== '0' && req.headers.get('content-type') !== null;
  const body = hasBody ? await parseJson(req, reminderRunSchema) : {};
  const run = await startReminderRun(user, body.weekOf);
  return NextResponse.json({ run }, { status: 202, headers: { Location: `/api/admin/reminders/runs/${run.id}` } });
});
