import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { degreeDaysBodySchema } from '@/lib/validation/season';
import { accumulate } from '@/lib/season/degree-days';

// Public and stateless: sums the days it is given, stores nothing.
export const POST = route(async (req) => {
  const body = await parseJson(req, degreeDaysBodySchema, { invalidStatus: 400, maxBytes: 200_000 });
  return NextResponse.json(accumulate(body.days, body.base), { headers: { 'cache-control': 'no-store' } });
});
