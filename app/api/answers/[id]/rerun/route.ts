import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { AppError } from '@/lib/errors';
import { requireUser } from '@/lib/auth/session';
import { rerunAnswer } from '@/lib/data/answers';

/** Today's engine and species data on the stored inputs, compared with the stored result. Saves nothing. */
export const GET = route<{ id: string }>(async (_req, { params }) => {
  const { id } = await params;
  const user = await requireUser();
  const rerun = await rerunAnswer(id, user);
  if (!rerun) throw new AppError('not_found:answer', 'No such answer.');
  return NextResponse.json(rerun);
});
