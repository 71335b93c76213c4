import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { AppError } from '@/lib/errors';
import { patchAnswerSchema } from '@/lib/validation/wizard';
import { requireUser } from '@/lib/auth/session';
import { deleteAnswer, getAnswer, updateAnswer } from '@/lib/data/answers';

type P = { id: string };

export const GET = route<P>(async (_req, { params }) => {
  const { id } = await params;
  const user = await requireUser();
  const answer = await getAnswer(id, user);
  if (!answer) throw new AppError('not_found:answer', 'No such answer.');
  return NextResponse.json(answer);
});

export const PATCH = route<P>(async (req, { params }) => {
  const user = await requireUser();
  const { id } = await params;
  const patch = await parseJson(req, patchAnswerSchema, { invalidStatus: 400 });
  return NextResponse.json(await updateAnswer(user, id, patch));
});

export const DELETE = route<P>(async (_req, { params }) => {
  const { id } = await params;
  const user = await requireUser();
  await deleteAnswer(user, id);
  return new NextResponse(null, { status: 204 });
});
