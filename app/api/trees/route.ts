import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { requireUser } from '@/lib/auth/session';
import { createTree, listTrees } from '@/lib/data/trees';
import { treeInputSchema } from '@/lib/validation/trees';

// The signed-in member's own trees.
export const GET = route(async () => {
  const actor = await requireUser();
  return NextResponse.json({ items: await listTrees(actor) });
});

export const POST = route(async (req) => {
  const actor = await requireUser();
  const input = await parseJson(req, treeInputSchema);
  const tree = await createTree(actor, input);
  return NextResponse.json({ tree }, { status: 201 });
});
