import { NextResponse } from 'next/server';
import { parseJson, parseQuery, route } from '@/lib/http/route';
import { listAnswersQuerySchema } from '@/lib/validation/wizard';
import { IDEMPOTENCY_HEADER, idempotencyKeySchema, saveAnswerWithPhoneSchema } from '@/lib/validation/offline';
import { requireUser } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';
import { listOwnAnswers, listSharedAnswers, saveAnswerOnce } from '@/lib/data/answers';

/** The signed-in user's own answers, newest first; `?scope=club` lists answers shared with the club. */
export const GET = route(async (req) => {
  const user = await requireUser();
  const { scope, ...q } = parseQuery(req, listAnswersQuerySchema);
  return NextResponse.json(await (scope === 'club' ? listSharedAnswers(user, q) : listOwnAnswers(user, q)));
});

/**
 * Evaluate and save: the evaluate body plus optional treeId, note, visibility and the phone's own
 * result. With an Idempotency-Key header the first save answers 201 and every repeat 200 with the
 * same answer, so a queue may retry freely.
 */
export const POST = route(async (req) => {
  const user = await requireUser();
  const body = await parseJson(req, saveAnswerWithPhoneSchema, { invalidStatus: 400 });
  const raw = req.headers.get(IDEMPOTENCY_HEADER);
  let idempotencyKey: string | undefined;
  if (raw !== null) {
    const k = idempotencyKeySchema.safeParse(raw);
    if (!k.success) throw new AppError('bad_request:idempotencyKey', k.error.issues[0].message, { [IDEMPOTENCY_HEADER]: [k.error.issues[0].message] });
    idempotencyKey = k.data;
  }
  const { created, answer } = await saveAnswerOnce(user, body, { idempotencyKey });
  return NextResponse.json(answer, { status: created ? 201 : 200 });
});
