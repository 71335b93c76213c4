import 'server-only';
import { notFound } from 'next/navigation';
import { getTree, type TreeDto } from '@/lib/data/trees';
import { isAppError } from '@/lib/errors';
import { treeIdSchema } from '@/lib/validation/trees';
import type { SessionUser } from '@/lib/auth/session';

/** The actor's tree for a page, or the 404 page (also for another member's tree). */
export async function loadTreeOr404(actor: SessionUser, id: string): Promise<TreeDto> {
  if (!treeIdSchema.safeParse(id).success) notFound();
  try {
    return await getTree(actor, id);
  } catch (e) {
    if (isAppError(e) && e.kind === 'not_found') notFound();
    throw e;
  }
}
