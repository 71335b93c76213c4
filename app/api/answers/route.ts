import { NextResponse } from 'next/server';
import { parseJson, parseQuery, route } from '@/lib/http/route';
import { listAnswersQuerySchema, saveAnswerSchema } from '@/lib/validation/wizard';
import { requireUser } from '@/lib/auth/session';
import { listOwnAnswers, listSharedAnswers, saveAnswer } from '@/lib/data/answers';

/** The signed-in user's own answers, newest first; `?scope=club` lists answers shared with the club. */
export const GET = route(async (req) => {
  const user = await requireUser();
  const { scope, ...q } = parseQuery(req, listAnswersQuerySchema);
  return NextResponse.json(await (scope === 'club' ? listSharedAnswers(user, q) : listOwnAnswers(user, q)));
});

/** Evaluate and save: the evaluate body plus optional treeId, note and visibility. */
export const POST = route(async (req) => {
  const user = await requireUser();
  const body = await parseJson(req, saveAnswerSchema, { invalidStatus: 400 });
  return NextResponse.json(await saveAnswer(user, body), { status: 201 });
});
