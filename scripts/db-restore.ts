import { openDatabase } from '../db/open';
import { compareChecksums, manifestFor } from '../db/backup';
import { restoreSqlToDir, restoreSqlToPostgres, restoreTarballToDir } from '../db/restore';
import { env } from '../lib/env';

// npm run db:restore -- <backup.tar.gz | backup.sql>
// Restores into a NEW database: PGLITE_DIR must not exist yet (or be empty), or with
// DATABASE_URL set, that PostgreSQL database must be empty (SQL dumps only). The result is
// checked against the manifest written beside the backup, then migrated to this version.
async function main() {
  const file = process.argv.slice(2).find((a) => !a.startsWith('--'));
  if (!file || !/\.(tar\.gz|sql)$/.test(file)) {
    throw new Error('Name the backup to restore: npm run db:restore -- backups/candlewise-<time>.tar.gz (or .sql)');
  }
  const isTarball = file.endsWith('.tar.gz');
  if (isTarball && env.DATABASE_URL)
    throw new Error('A PGlite tarball restores into PGLITE_DIR; unset DATABASE_URL, or restore the .sql dump into PostgreSQL.');

  const restored = env.DATABASE_URL
    ? await restoreSqlToPostgres(file, env.DATABASE_URL)
    : isTarball
      ? await restoreTarballToDir(file, env.PGLITE_DIR)
      : await restoreSqlToDir(file, env.PGLITE_DIR);

  const manifest = manifestFor(file);
  if (manifest) {
    const diffs = compareChecksums(manifest.tables, restored);
    if (diffs.length) throw new Error(`The restored database differs from the backup:\n  ${diffs.join('\n  ')}`);
  }
  // Bring the restored database to this version's schema (no-op when it is already current).
  const handle = await openDatabase({ databaseUrl: env.DATABASE_URL, pgliteDir: env.PGLITE_DIR });
  await handle.close();
  const rows = Object.values(restored).reduce((s, t) => s + t.rows, 0);
  console.log(`restored ${file} into ${env.DATABASE_URL ? 'PostgreSQL' : env.PGLITE_DIR}: ${Object.keys(restored).length} tables, ${rows} rows`);
  console.log(manifest ? 'row counts and checksums match the manifest' : 'no manifest beside the file: contents not verified');
}

main().catch((e) => {
  console.error(e instanceof Error ? e.message : e);
  process.exit(1);
});
