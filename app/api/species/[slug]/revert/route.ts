import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { requireRole } from '@/lib/auth/session';
import { revertSpecies } from '@/lib/data/species-editorial';
import { parseSlug } from '@/lib/http/species-params';
import { speciesRevertSchema } from '@/lib/validation/species';

// Editor or admin: copy an old revision into a new one (published unless `publish: false`).
export const POST = route<{ slug: string }>(async (req, ctx) => {
  const actor = await requireRole('editor', 'species');
  const slug = parseSlug(await ctx.params);
  const input = await parseJson(req, speciesRevertSchema);
  return NextResponse.json({ species: await revertSpecies(actor, slug, input) }, { status: 201 });
});
