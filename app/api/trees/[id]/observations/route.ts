import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { requireUser } from '@/lib/auth/session';
import { getTree } from '@/lib/data/trees';
import { addObservation } from '@/lib/data/season';
import { treeIdOf } from '@/lib/http/tree-id';
import { observationBodySchema } from '@/lib/validation/plan';
import { todayIso } from '@/lib/validation/trees';

type Params = { id: string };

// "Seen today" (a shoot state) or "Done" (a task): re-anchors the tree's plan.
export const POST = route<Params>(async (req, { params }) => {
  const actor = await requireUser();
  const body = await parseJson(req, observationBodySchema);
  const tree = await getTree(actor, await treeIdOf(params));
  const date = body.date ?? todayIso();
  await addObservation(actor.id, tree.id, { date, shoot: body.shoot, task: body.task });
  return NextResponse.json({ observation: { date, shoot: body.shoot ?? null, task: body.task ?? null } }, { status: 201 });
});
