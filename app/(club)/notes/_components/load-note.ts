import 'server-only';
import { notFound } from 'next/navigation';
import { getNote, type NoteDto } from '@/lib/data/notes';
import { isAppError } from '@/lib/errors';
import { noteSlugSchema } from '@/lib/validation/notes';
import type { SessionUser } from '@/lib/auth/session';

/** A note the viewer may see, or the 404 page (also for a draft seen by a member). */
export async function loadNoteOr404(viewer: SessionUser, slug: string): Promise<NoteDto> {
  if (!noteSlugSchema.safeParse(slug).success) notFound();
  try {
    return await getNote(viewer, slug);
  } catch (e) {
    if (isAppError(e) && e.kind === 'not_found') notFound();
    throw e;
  }
}
