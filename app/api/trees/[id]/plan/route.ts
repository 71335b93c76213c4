import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { requireUser } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { getTreePlan } from '@/lib/data/plan';
import { treeIdOf } from '@/lib/http/tree-id';

type Params = { id: string };

export const GET = route<Params>(async (_req, { params }) => {
  const actor = await requireUser();
  const plan = await getTreePlan(actor, await treeIdOf(params));
  if (!plan) throw new AppError('not_found:species', 'This tree’s species is not published, so it has no plan.');
  return NextResponse.json(
    {
      windows: plan.windows,
      degreeDaysToDate: plan.degreeDaysToDate,
      basis: plan.basis,
      seasonStart: plan.seasonStart,
      timeline: plan.timeline,
      notes: plan.notes,
    },
    { headers: { 'cache-control': 'no-store' } },
  );
});
