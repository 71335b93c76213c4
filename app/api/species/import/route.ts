import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { requireRole } from '@/lib/auth/session';
import { commitSpeciesImport } from '@/lib/data/species-editorial';
import { speciesImportSchema } from '@/lib/validation/species';

// Editor or admin: import the files. All valid, or nothing is written (422 with the fields per file);
// with `skipInvalid` the valid ones are written and the others listed in `skipped`.
export const POST = route({ maxBytes: 4_000_000 }, async (req) => {
  const actor = await requireRole('editor', 'species');
  const input = await parseJson(req, speciesImportSchema, { maxBytes: 4_000_000 });
  return NextResponse.json(await commitSpeciesImport(actor, input), { status: 201 });
});
