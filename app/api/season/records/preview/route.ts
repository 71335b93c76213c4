import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { requireUser } from '@/lib/auth/session';
import { assertMayWriteRecord } from '@/lib/http/record-scope';
import { previewImport } from '@/lib/data/season';
import { recordImportSchema } from '@/lib/validation/plan';

// What an import would write, with every row error, before anything is written.
export const POST = route(async (req) => {
  const actor = await requireUser();
  await assertMayWriteRecord(req, actor);
  const body = await parseJson(req, recordImportSchema, { maxBytes: 3_200_000 });
  return NextResponse.json({ preview: await previewImport(actor, body.scope, body.csv) });
});
