// npm run species:export [-- <folder>]: write every published species back to the
// content/species format (one .md a species). Default folder: content/species.
// Stop the app first when it uses the same PGlite directory (one process per directory).
import fs from 'node:fs';
import path from 'node:path';
import { openDatabase } from '../db/open';
import { setDbHandle } from '../db/client';
import { env } from '../lib/env';
import { listPublishedRecords } from '../lib/data/species';
import { serializeSpeciesMarkdown, SPECIES_CONTENT_DIR } from '../lib/species/content';

async function main() {
  const out = path.resolve(process.argv[2] ?? SPECIES_CONTENT_DIR);
  const handle = await openDatabase({ databaseUrl: env.DATABASE_URL, pgliteDir: env.PGLITE_DIR });
  try {
    setDbHandle(handle);
    const records = await listPublishedRecords();
    fs.mkdirSync(out, { recursive: true });
    for (const { record, body } of records) fs.writeFileSync(path.join(out, `${record.slug}.md`), serializeSpeciesMarkdown(record, body));
    console.log(`wrote ${records.length} species to ${out}`);
  } finally {
    await handle.close();
  }
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
