import { NextResponse } from 'next/server';
import { parseJson, route } from '@/lib/http/route';
import { requireRole } from '@/lib/auth/session';
import { previewSpeciesImport } from '@/lib/data/species-editorial';
import { speciesImportSchema } from '@/lib/validation/species';

// Editor or admin: validate uploaded .md files and say what an import would do. Writes nothing.
export const POST = route({ maxBytes: 4_000_000 }, async (req) => {
  const actor = await requireRole('editor', 'species');
  const input = await parseJson(req, speciesImportSchema, { maxBytes: 4_000_000 });
  return NextResponse.json({ files: await previewSpeciesImport(actor, input.files) });
});
