import 'server-only';
import { hasRole } from '@/lib/auth/roles';
import type { SessionUser } from '@/lib/auth/session';
import { AppError } from '@/lib/errors';

/**
 * Authorise a temperature-record write before its body is validated: below librarian, only a
 * member's own record ("scope": "member") may be written, so a caller who may not write the
 * club record gets 403 whatever the body, never the schema's field errors.
 */
export async function assertMayWriteRecord(req: Request, actor: SessionUser): Promise<void> {
  if (hasRole(actor.role, 'librarian')) return;
  const raw: unknown = await req
    .clone()
    .json()
    .catch(() => null);
  const scope = raw && typeof raw === 'object' ? (raw as { scope?: unknown }).scope : undefined;
  if (scope !== 'member') {
    throw new AppError(
      'forbidden:temperature_record',
      'Only a librarian or an administrator keeps the club’s temperature record; members may import their own.',
    );
  }
}
