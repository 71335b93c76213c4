import fs from 'node:fs';
import path from 'node:path';
import { openDatabase } from '../db/open';
import { backupBaseName, dumpSql, snapshotterForDrizzle, tableChecksums, type Manifest } from '../db/backup';
import { env } from '../lib/env';

// npm run db:backup [-- --out <dir>]
// Writes <dir>/candlewise-<time>.sql (loads into any PostgreSQL server), and for PGlite also
// <dir>/candlewise-<time>.tar.gz (PGlite's data-directory dump), with a manifest of row counts
// and per-table checksums. A PGlite directory can be backed up only while no server holds it
// (the directory lock refuses); stop the server first.
function outDir() {
  const i = process.argv.indexOf('--out');
  return path.resolve(i > 0 ? process.argv[i + 1] : (process.env.BACKUP_DIR ?? 'backups'));
}

async function main() {
  const dir = outDir();
  fs.mkdirSync(dir, { recursive: true });
  const handle = await openDatabase({ databaseUrl: env.DATABASE_URL, pgliteDir: env.PGLITE_DIR });
  try {
    const base = path.join(dir, backupBaseName());
    const snapshot = snapshotterForDrizzle(handle.db);
    const tables = await tableChecksums(snapshot);
    const source = handle.kind === 'pglite' ? `PGlite ${env.PGLITE_DIR}` : 'PostgreSQL';
    fs.writeFileSync(`${base}.sql`, await dumpSql(snapshot, { source }));
    const files: Manifest['files'] = { sql: path.basename(`${base}.sql`) };
    if (handle.pglite) {
      const blob = await handle.pglite.dumpDataDir('gzip');
      fs.writeFileSync(`${base}.tar.gz`, Buffer.from(await blob.arrayBuffer()));
      files.tarball = path.basename(`${base}.tar.gz`);
    }
    const manifest: Manifest = { format: 'candlewise-backup/1', createdAt: new Date().toISOString(), source: handle.kind, files, tables };
    fs.writeFileSync(`${base}.manifest.json`, JSON.stringify(manifest, null, 2) + '\n');
    const rows = Object.values(tables).reduce((s, t) => s + t.rows, 0);
    console.log(
      `backup written: ${[files.tarball, files.sql]
        .filter(Boolean)
        .map((f) => path.join(dir, f!))
        .join(', ')}`,
    );
    console.log(`${Object.keys(tables).length} tables, ${rows} rows; checksums in ${base}.manifest.json`);
  } finally {
    await handle.close();
  }
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
