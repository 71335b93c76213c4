import { strToU8, zipSync } from 'fflate';
import { route } from '@/lib/http/route';
import { listPublishedRecords } from '@/lib/data/species';
import { serializeSpeciesMarkdown } from '@/lib/species/content';

// Anyone: every published species as a zip of .md files, in the content/species format.
export const GET = route(async () => {
  const files: Record<string, Uint8Array> = {};
  for (const { record, body } of await listPublishedRecords()) files[`${record.slug}.md`] = strToU8(serializeSpeciesMarkdown(record, body));
  const zip = zipSync(files, { level: 6, mtime: new Date('2026-01-01T00:00:00Z') });
  return new Response(new Blob([zip as BlobPart], { type: 'application/zip' }), {
    headers: {
      'content-type': 'application/zip',
      'content-disposition': 'attachment; filename="candlewise-species.zip"',
      'x-content-type-options': 'nosniff',
    },
  });
});
