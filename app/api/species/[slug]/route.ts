import { NextResponse } from 'next/server';
import { parseJson, parseQuery, route } from '@/lib/http/route';
import { getCurrentUser, requireRole } from '@/lib/auth/session';
import { getSpeciesForViewer } from '@/lib/data/species';
import { updateSpecies } from '@/lib/data/species-editorial';
import { parseSlug, revisionQuerySchema } from '@/lib/http/species-params';
import { speciesPatchSchema } from '@/lib/validation/species';

// GET: anyone sees the published revision; `?revision=N` is for editors and admins.
// PATCH: editor or admin, with `baseRevision` (a stale one gets 409).
export const GET = route<{ slug: string }>(async (req, ctx) => {
  const slug = parseSlug(await ctx.params);
  const { revision } = parseQuery(req, revisionQuerySchema);
  const viewer = revision === undefined ? await getCurrentUser() : await requireRole('editor', 'revision');
  return NextResponse.json({ species: await getSpeciesForViewer(viewer, slug, revision) });
});

export const PATCH = route<{ slug: string }>(async (req, ctx) => {
  const actor = await requireRole('editor', 'species');
  const slug = parseSlug(await ctx.params);
  const input = await parseJson(req, speciesPatchSchema);
  return NextResponse.json({ species: await updateSpecies(actor, slug, input) });
});
