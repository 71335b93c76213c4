import { NextResponse } from 'next/server';
import { sql } from 'drizzle-orm';
import { getDbHandle } from '@/db/client';
import { invalidationListenerState } from '@/lib/data/invalidation';

export const dynamic = 'force-dynamic';

// The benchmark floor: one trivial query, no session. `invalidation` is the state of this
// process's cache-invalidation listener (lib/data/invalidation.ts): 'live' on PostgreSQL once it
// hears the other processes, 'off' on PGlite.
export async function GET() {
  try {
    const handle = await getDbHandle();
    await handle.db.execute(sql`select 1`);
    return NextResponse.json({ ok: true, database: { ok: true, kind: handle.kind }, invalidation: invalidationListenerState(handle) });
  } catch (e) {
    console.error('[candlewise] health check failed', e);
    return NextResponse.json({ ok: false, database: { ok: false } }, { status: 503 });
  }
}
