import 'server-only';
import { desc } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { outboxMessages } from '@/db/schema';
import type { SessionUser } from '@/lib/auth/session';
import { assertRole } from '@/lib/auth/roles';

export interface OutboxMessageDto {
  id: number;
  to: string[];
  from: string;
  subject: string;
  text: string | null;
  html: string | null;
  receivedAt: string;
}

const dtoColumns = {
  id: outboxMessages.id,
  to: outboxMessages.envelopeTo,
  from: outboxMessages.envelopeFrom,
  subject: outboxMessages.subject,
  text: outboxMessages.text,
  html: outboxMessages.html,
  receivedAt: outboxMessages.receivedAt,
};

function requireAdmin(actor: SessionUser) {
  assertRole(actor, 'admin', 'outbox', 'Only administrators read the outbox.');
}

export async function listOutbox(actor: SessionUser, limit = 50): Promise<OutboxMessageDto[]> {
  requireAdmin(actor);
  const db = await getDb();
  const rows = await db
    .select(dtoColumns)
    .from(outboxMessages)
    .orderBy(desc(outboxMessages.id))
    .limit(Math.min(Math.max(limit, 1), 200));
  return rows.map((r) => ({ ...r, receivedAt: r.receivedAt.toISOString() }));
}
