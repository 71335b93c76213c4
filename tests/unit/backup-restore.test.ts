import { afterAll, describe, expect, it } from 'vitest';
import { spawnSync } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { openDatabase } from '@/db/open';
import { compareChecksums, snapshotterForDrizzle, tableChecksums, type Checksums, type Manifest } from '@/db/backup';
import { outboxMessages } from '@/db/schema';
import { seed } from '@/db/seed';
import { fillAwkwardRows } from '../support/backup-fixture';

// The round trip through the real commands: npm run db:backup, then db:restore of the PGlite
// tarball and of the SQL dump into new directories; every table must come back with the same
// row count and checksum.
const root = path.resolve(__dirname, '../..');
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-backup-'));
afterAll(() => fs.rmSync(work, { recursive: true, force: true }));

function run(script: 'db-backup' | 'db-restore', args: string[], pgliteDir: string) {
  const r = spawnSync(process.execPath, ['--import', 'tsx', '--conditions=react-server', `scripts/${script}.ts`, ...args], {
    cwd: root,
    env: { ...process.env, PGLITE_DIR: pgliteDir, DATABASE_URL: '' },
    encoding: 'utf8',
  });
  return { code: r.status, out: `${r.stdout}${r.stderr}` };
}

async function checksumsOf(dir: string): Promise<Checksums> {
  const h = await openDatabase({ pgliteDir: dir });
  try {
    return await tableChecksums(snapshotterForDrizzle(h.db));
  } finally {
    await h.close();
  }
}

describe('backup and restore', () => {
  const source = path.join(work, 'source');
  const out = path.join(work, 'backups');
  let original: Checksums;
  let manifestFile: string;

  it('backs up a PGlite directory to a tarball, a SQL dump and a manifest', async () => {
    const h = await openDatabase({ pgliteDir: source });
    await seed(h.db);
    await fillAwkwardRows(h.db);
    original = await tableChecksums(snapshotterForDrizzle(h.db));
    await h.close();
    // Every table holds rows, so the comparison below covers each one.
    const empty = Object.entries(original).filter(([n, t]) => t.rows === 0 && !['public.accounts', 'public.sessions'].includes(n));
    expect(empty).toEqual([]);

    const r = run('db-backup', ['--out', out], source);
    expect(r.code, r.out).toBe(0);
    manifestFile = fs.readdirSync(out).find((f) => f.endsWith('.manifest.json'))!;
    const manifest = JSON.parse(fs.readFileSync(path.join(out, manifestFile), 'utf8')) as Manifest;
    expect(manifest.tables).toEqual(original);
    expect(fs.statSync(path.join(out, manifest.files.tarball!)).size).toBeGreaterThan(0);
    const dump = fs.readFileSync(path.join(out, manifest.files.sql), 'utf8');
    // Parents before children: users before answers before photos.
    const at = (t: string) => dump.indexOf(`-- data: public.${t} `);
    expect(at('users')).toBeLessThan(at('trees'));
    expect(at('trees')).toBeLessThan(at('answers'));
    expect(at('answers')).toBeLessThan(at('photos'));
    expect(at('notes')).toBeLessThan(at('note_links'));
  }, 120_000);

  it('restores the tarball into a new directory with identical tables', async () => {
    const base = manifestFile.replace('.manifest.json', '');
    const target = path.join(work, 'from-tarball');
    const r = run('db-restore', [path.join(out, `${base}.tar.gz`)], target);
    expect(r.code, r.out).toBe(0);
    expect(r.out).toContain('checksums match the manifest');
    expect(compareChecksums(original, await checksumsOf(target))).toEqual([]);
  }, 120_000);

  it('restores the SQL dump into a new directory with identical tables and working sequences', async () => {
    const base = manifestFile.replace('.manifest.json', '');
    const target = path.join(work, 'from-sql');
    const r = run('db-restore', [path.join(out, `${base}.sql`)], target);
    expect(r.code, r.out).toBe(0);
    expect(compareChecksums(original, await checksumsOf(target))).toEqual([]);
    const h = await openDatabase({ pgliteDir: target });
    try {
      const before = await h.db.select({ id: outboxMessages.id }).from(outboxMessages);
      const [next] = await h.db
        .insert(outboxMessages)
        .values({ envelopeFrom: 'x@candlewise.test', envelopeTo: [], raw: 'x' })
        .returning({ id: outboxMessages.id });
      expect(next.id).toBe(Math.max(...before.map((b) => b.id)) + 1);
    } finally {
      await h.close();
    }
  }, 120_000);

  it('refuses to restore over an existing database, and notices a backup that does not match its manifest', async () => {
    const base = manifestFile.replace('.manifest.json', '');
    const over = run('db-restore', [path.join(out, `${base}.sql`)], source);
    expect(over.code).toBe(1);
    expect(over.out).toContain('already holds a database');
    expect(await checksumsOf(source)).toEqual(original);

    // A dump whose contents were altered after the manifest was written.
    const tampered = path.join(work, 'tampered');
    fs.mkdirSync(tampered);
    const dump = fs.readFileSync(path.join(out, `${base}.sql`), 'utf8').replace('Riverside Pine Study Group', 'Riverside Pine Study Grouq');
    fs.writeFileSync(path.join(tampered, `${base}.sql`), dump);
    fs.copyFileSync(path.join(out, manifestFile), path.join(tampered, manifestFile));
    const r = run('db-restore', [path.join(tampered, `${base}.sql`)], path.join(work, 'from-tampered'));
    expect(r.code).toBe(1);
    expect(r.out).toContain('public.club_settings: same row count, different contents');
  }, 120_000);
});
