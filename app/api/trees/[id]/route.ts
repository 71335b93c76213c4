import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { requireUser } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { deleteTree, getTree, updateTree } from '@/lib/data/trees';
import { treeIdSchema, treePatchSchema } from '@/lib/validation/trees';

type Params = { id: string };

async function idOf(params: Promise<Params>) {
  const { id } = await params;
  // A malformed id cannot name anybody's tree: the same 404 as an unknown one.
  if (!treeIdSchema.safeParse(id).success) throw new AppError('not_found:tree', 'No such tree.');
  return id;
}

export const GET = route<Params>(async (_req, { params }) => {
  const actor = await requireUser();
  const id = await idOf(params);
  return NextResponse.json({ tree: await getTree(actor, id) });
});

export const PATCH = route<Params>(async (req, { params }) => {
  const actor = await requireUser();
  const patch = await parseJson(req, treePatchSchema);
  const id = await idOf(params);
  return NextResponse.json({ tree: await updateTree(actor, id, patch) });
});

export const DELETE = route<Params>(async (_req, { params }) => {
  const actor = await requireUser();
  const id = await idOf(params);
  await deleteTree(actor, id);
  return new NextResponse(null, { status: 204 });
});
