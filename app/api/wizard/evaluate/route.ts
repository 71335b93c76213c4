import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { evaluateBodySchema } from '@/lib/validation/wizard';
import { runWizard } from '@/lib/data/wizard';

// Public and stateless: evaluates and answers, stores and logs nothing.
export const POST = route(async (req) => {
  const body = await parseJson(req, evaluateBodySchema, { invalidStatus: 400 });
  const { result } = await runWizard(body);
  return NextResponse.json(result, { headers: { 'cache-control': 'no-store' } });
});
