import { AppError } from '@/lib/errors';
import { treeIdSchema } from '@/lib/validation/trees';

/** A malformed tree id cannot name anybody's tree: the same 404 as an unknown one. */
export async function treeIdOf(params: Promise<{ id: string }>): Promise<string> {
  const { id } = await params;
  if (!treeIdSchema.safeParse(id).success) throw new AppError('not_found:tree', 'No such tree.');
  return id;
}
