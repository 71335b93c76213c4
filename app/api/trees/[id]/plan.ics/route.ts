import ical from 'ical-generator';
import { route } from '@/lib/http/route';
import { requireUser } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { getTree } from '@/lib/data/trees';
import { getTreePlan } from '@/lib/data/plan';
import { treeIdOf } from '@/lib/http/tree-id';
import { addDays } from '@/lib/season/degree-days';

type Params = { id: string };

// One all-day event per window of the tree's plan, for any calendar app.
export const GET = route<Params>(async (_req, { params }) => {
  const actor = await requireUser();
  const id = await treeIdOf(params);
  const tree = await getTree(actor, id);
  const plan = await getTreePlan(actor, id);
  if (!plan) throw new AppError('not_found:species', 'This tree’s species is not published, so it has no plan.');
  const cal = ical({ name: `Candlewise: ${tree.name}`, prodId: { company: 'candlewise', product: 'season-plan', language: 'EN' } });
  for (const w of plan.windows) {
    cal.createEvent({
      id: `${tree.id}-${w.task}-${w.from}@candlewise`,
      allDay: true,
      start: new Date(`${w.from}T00:00:00Z`),
      // All-day events end on the day after their last day.
      end: new Date(`${addDays(w.to, 1)}T00:00:00Z`),
      summary: `${w.label}: ${tree.name}`,
      description: w.reasons.join('\n'),
    });
  }
  return new Response(cal.toString(), {
    headers: {
      'content-type': 'text/calendar; charset=utf-8',
      'content-disposition': `attachment; filename="tree-${tree.id}.ics"`,
      'cache-control': 'no-store',
    },
  });
});
