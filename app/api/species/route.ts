import { NextResponse } from 'next/server';
import { parseJson, parseQuery, route } from '@/lib/http/route';
import { getCurrentUser, requireRole } from '@/lib/auth/session';
import { listSpecies } from '@/lib/data/species-list';
import { createSpecies } from '@/lib/data/species-editorial';
import { speciesCreateSchema, speciesListQuerySchema } from '@/lib/validation/species';

// GET: anyone (published species; editors also see draft-only ones). POST: editor or admin.
export const GET = route(async (req) => {
  const query = parseQuery(req, speciesListQuerySchema);
  const viewer = await getCurrentUser();
  return NextResponse.json(await listSpecies(viewer, query));
});

export const POST = route(async (req) => {
  const actor = await requireRole('editor', 'species');
  const input = await parseJson(req, speciesCreateSchema);
  const saved = await createSpecies(actor, input);
  return NextResponse.json({ species: saved }, { status: 201 });
});
