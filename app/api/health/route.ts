import { NextResponse } from 'next/server';
import { sql } from 'drizzle-orm';
import { getDbHandle } from '@/db/client';

export const dynamic = 'force-dynamic';

// The benchmark floor: one trivial query, no session.
export async function GET() {
  try {
    const { db, kind } = await getDbHandle();
    await db.execute(sql`select 1`);
    return NextResponse.json({ ok: true, database: { ok: true, kind } });
  } catch (e) {
    console.error('[candlewise] health check failed', e);
    return NextResponse.json({ ok: false, database: { ok: false } }, { status: 503 });
  }
}
