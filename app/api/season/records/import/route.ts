import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { requireUser } from '@/lib/auth/session';
import { assertMayWriteRecord } from '@/lib/http/record-scope';
import { importRecord } from '@/lib/data/season';
import { recordImportSchema } from '@/lib/validation/plan';

// Writes the days of a CSV with no row errors; the same days imported again are replaced.
export const POST = route(async (req) => {
  const actor = await requireUser();
  await assertMayWriteRecord(req, actor);
  const body = await parseJson(req, recordImportSchema, { maxBytes: 3_200_000 });
  return NextResponse.json(await importRecord(actor, body.scope, body.csv), { status: 201 });
});
