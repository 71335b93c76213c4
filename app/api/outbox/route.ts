import { NextResponse } from 'next/server';
import { z } from 'zod';
import { parseQuery, route } from '@/lib/http/route';
import { listOutbox } from '@/lib/data/outbox';
import { requireUser } from '@/lib/auth/session';

const query = z.object({ limit: z.coerce.number().int().min(1).max(200).optional() });

export const GET = route(async (req) => {
  const actor = await requireUser();
  const { limit } = parseQuery(req, query);
  return NextResponse.json({ items: await listOutbox(actor, limit) });
});
