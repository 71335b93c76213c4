import { NextResponse } from 'next/server';
import { parseQuery, route } from '@/lib/http/route';
import { requireRole } from '@/lib/auth/session';
import { searchLinkableAnswers } from '@/lib/data/linkable-answers';
import { linkableAnswersQuerySchema } from '@/lib/validation/notes';

// The note editor's picker: answers shared with the club (librarian or admin).
export const GET = route(async (req) => {
  const actor = await requireRole('librarian', 'notes');
  const query = parseQuery(req, linkableAnswersQuerySchema);
  return NextResponse.json({ items: await searchLinkableAnswers(actor, query) });
});
