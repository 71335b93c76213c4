import { NextResponse } from 'next/server';
import { route } from '@/lib/http/route';
import { requireUser } from '@/lib/auth/session';
import { listSpeciesRevisions } from '@/lib/data/species';
import { parseSlug } from '@/lib/http/species-params';

// Signed-in users: members see published revisions only, editors every revision.
export const GET = route<{ slug: string }>(async (_req, ctx) => {
  const viewer = await requireUser();
  const slug = parseSlug(await ctx.params);
  return NextResponse.json({ revisions: await listSpeciesRevisions(viewer, slug) });
});
