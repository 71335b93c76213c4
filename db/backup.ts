import 'server-only';
import crypto from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import type { Db } from './open';

// Backups in two forms:
// - PGlite's own data-directory tarball (dumpDataDir), restored with loadDataDir: exact and fast;
// - a plain SQL dump (the schema from our migrations, then INSERTs table by table in foreign-key
//   order) that psql can load into any PostgreSQL server, or that PGlite can load back.
// A manifest of row counts and per-table checksums (md5 of the ordered rows) goes beside both so
// a restore can prove it brought back exactly what was saved.

type Row = Record<string, unknown>;
/** Runs `fn` inside one read-only, repeatable-read transaction with a fixed output format. */
export type Snapshotter = <T>(fn: (query: (text: string) => Promise<Row[]>) => Promise<T>) => Promise<T>;

const SESSION_SETTINGS = [
  // Output that reads back identically everywhere: UTC timestamps, ISO dates, exact floats.
  "SET LOCAL TimeZone = 'UTC'",
  "SET LOCAL DateStyle = 'ISO, YMD'",
  'SET LOCAL IntervalStyle = postgres',
  'SET LOCAL extra_float_digits = 1',
];

const rowsOf = (r: unknown): Row[] => (Array.isArray(r) ? (r as Row[]) : ((r as { rows: Row[] }).rows ?? []));

export function snapshotterForDrizzle(db: Db): Snapshotter {
  return (fn) =>
    db.transaction(
      async (tx) => {
        for (const s of SESSION_SETTINGS) await tx.execute(sql.raw(s));
        return fn(async (text) => rowsOf(await tx.execute(sql.raw(text))));
      },
      { isolationLevel: 'repeatable read', accessMode: 'read only' },
    );
}

export function snapshotterForPglite(pg: import('@electric-sql/pglite').PGlite): Snapshotter {
  return (fn) =>
    pg.transaction(async (tx) => {
      for (const s of SESSION_SETTINGS) await tx.query(s);
      return fn(async (text) => (await tx.query<Row>(text)).rows);
    });
}

interface TableInfo {
  schema: string;
  name: string;
  columns: string[];
  primaryKey: string[];
  /** Columns fed by a sequence (serial), whose sequence must be moved past the restored rows. */
  serialColumns: string[];
  /** Tables this one references (foreign keys), as `schema.name`. */
  references: string[];
}

const SCHEMAS = ['public', 'drizzle'];
const qi = (s: string) => `"${s.replace(/"/g, '""')}"`;
const qname = (t: { schema: string; name: string }) => `${qi(t.schema)}.${qi(t.name)}`;
const key = (t: { schema: string; name: string }) => `${t.schema}.${t.name}`;

/** Every base table in our schemas, parents before children. */
async function listTables(query: (text: string) => Promise<Row[]>): Promise<TableInfo[]> {
  const inList = SCHEMAS.map((s) => `'${s}'`).join(',');
  const tables = await query(`
    select n.nspname::text as schema, c.relname::text as name, c.oid::int as oid
    from pg_class c join pg_namespace n on n.oid = c.relnamespace
    where c.relkind = 'r' and n.nspname in (${inList})
    order by 1, 2`);
  const cols = await query(`
    select a.attrelid::int as oid, a.attname::text as col,
           pg_get_serial_sequence(quote_ident(n.nspname) || '.' || quote_ident(c.relname), a.attname) is not null as serial
    from pg_attribute a join pg_class c on c.oid = a.attrelid join pg_namespace n on n.oid = c.relnamespace
    where c.relkind = 'r' and n.nspname in (${inList}) and a.attnum > 0 and not a.attisdropped
    order by a.attrelid, a.attnum`);
  const pks = await query(`
    select i.indrelid::int as oid, a.attname::text as col, array_position(i.indkey::int2[], a.attnum) as pos
    from pg_index i join pg_attribute a on a.attrelid = i.indrelid and a.attnum = any(i.indkey)
    where i.indisprimary
    order by i.indrelid, pos`);
  const fks = await query(`
    select conrelid::int as oid, pn.nspname::text as schema, p.relname::text as name
    from pg_constraint k join pg_class p on p.oid = k.confrelid join pg_namespace pn on pn.oid = p.relnamespace
    where k.contype = 'f'`);
  const byOid = new Map<number, TableInfo>();
  for (const t of tables) {
    byOid.set(Number(t.oid), { schema: String(t.schema), name: String(t.name), columns: [], primaryKey: [], serialColumns: [], references: [] });
  }
  for (const c of cols) {
    const t = byOid.get(Number(c.oid));
    if (!t) continue;
    t.columns.push(String(c.col));
    if (c.serial === true || c.serial === 't') t.serialColumns.push(String(c.col));
  }
  for (const p of pks) byOid.get(Number(p.oid))?.primaryKey.push(String(p.col));
  for (const f of fks) {
    const t = byOid.get(Number(f.oid));
    const parent = `${f.schema}.${f.name}`;
    if (t && parent !== key(t) && !t.references.includes(parent)) t.references.push(parent);
  }
  // Topological order, stable by name.
  const all = [...byOid.values()].sort((a, b) => key(a).localeCompare(key(b)));
  const done = new Set<string>();
  const out: TableInfo[] = [];
  while (out.length < all.length) {
    const next = all.find((t) => !done.has(key(t)) && t.references.every((r) => done.has(r) || !all.some((x) => key(x) === r)));
    if (!next) throw new Error('The foreign keys form a cycle; this dump format cannot order the tables.');
    done.add(key(next));
    out.push(next);
  }
  return out;
}

const orderBy = (t: TableInfo) => (t.primaryKey.length ? t.primaryKey : t.columns).map(qi).join(', ');

interface TableChecksum {
  rows: number;
  md5: string;
}
export type Checksums = Record<string, TableChecksum>;

/** Row count and md5 over the rows' text in primary-key order, per table. */
export async function tableChecksums(snapshot: Snapshotter): Promise<Checksums> {
  return snapshot(async (query) => {
    const out: Checksums = {};
    for (const t of await listTables(query)) {
      const [r] = await query(`select count(*)::int as rows, md5(coalesce(string_agg(x::text, E'\\n' order by ${orderBy(t)}), '')) as md5 from ${qname(t)} x`);
      out[key(t)] = { rows: Number(r.rows), md5: String(r.md5) };
    }
    return out;
  });
}

interface Migration {
  tag: string;
  sql: string;
  hash: string;
}

function readMigrations(folder = path.resolve(process.cwd(), 'db/migrations')): Migration[] {
  const journal = JSON.parse(fs.readFileSync(path.join(folder, 'meta/_journal.json'), 'utf8')) as { entries: { tag: string }[] };
  return journal.entries.map(({ tag }) => {
    const text = fs.readFileSync(path.join(folder, `${tag}.sql`), 'utf8');
    // The same hash drizzle's migrator stores in drizzle.__drizzle_migrations.
    return { tag, sql: text, hash: crypto.createHash('sha256').update(text).digest('hex') };
  });
}

const ROWS_PER_INSERT = 500;

/**
 * A plain SQL dump: the schema as our migrations build it (only those the source database has
 * applied), the migrator's bookkeeping, then every row as INSERT statements in foreign-key order,
 * and the sequences moved past the restored ids. One transaction; load into an empty database.
 */
export async function dumpSql(snapshot: Snapshotter, opts: { migrationsFolder?: string; source?: string } = {}): Promise<string> {
  const migrations = readMigrations(opts.migrationsFolder);
  return snapshot(async (query) => {
    const tables = await listTables(query);
    const bookkeeping = tables.find((t) => t.schema === 'drizzle' && t.name === '__drizzle_migrations');
    if (!bookkeeping) throw new Error('This database has no drizzle.__drizzle_migrations table: it was not created by Candlewise.');
    const applied = (await query(`select hash from drizzle.__drizzle_migrations order by id`)).map((r) => String(r.hash));
    const known = new Map(migrations.map((m) => [m.hash, m]));
    const unknown = applied.filter((h) => !known.has(h));
    if (unknown.length) {
      throw new Error(`The database has ${unknown.length} migration(s) this checkout does not know; dump it with the matching version.`);
    }

    const out: string[] = [];
    out.push(
      `-- Candlewise SQL dump${opts.source ? ` of ${opts.source}` : ''}, ${new Date().toISOString()}`,
      '-- Load into an EMPTY PostgreSQL database: psql -v ON_ERROR_STOP=1 -d <database> -f <this file>',
      "SET client_encoding = 'UTF8';",
      'SET standard_conforming_strings = on;',
      "SET TimeZone = 'UTC';",
      'BEGIN;',
      '',
    );
    for (const h of applied) {
      const m = known.get(h)!;
      out.push(`-- schema: migration ${m.tag}`, m.sql.replaceAll('--> statement-breakpoint', '\n'), '');
    }
    out.push(
      'CREATE SCHEMA IF NOT EXISTS "drizzle";',
      'CREATE TABLE IF NOT EXISTS "drizzle"."__drizzle_migrations" (id SERIAL PRIMARY KEY, hash text NOT NULL, created_at bigint);',
      '',
    );
    for (const t of tables) {
      const values = await query(
        `select '(' || concat_ws(',', ${t.columns.map((c) => `quote_nullable(${qi(c)}::text)`).join(', ')}) || ')' as v from ${qname(t)} order by ${orderBy(t)}`,
      );
      out.push(`-- data: ${key(t)} (${values.length} rows)`);
      const head = `INSERT INTO ${qname(t)} (${t.columns.map(qi).join(', ')}) VALUES\n`;
      for (let i = 0; i < values.length; i += ROWS_PER_INSERT) {
        out.push(
          head +
            values
              .slice(i, i + ROWS_PER_INSERT)
              .map((r) => `  ${r.v}`)
              .join(',\n') +
            ';',
        );
      }
      for (const c of t.serialColumns) {
        out.push(
          `SELECT setval(pg_get_serial_sequence('${qname(t).replace(/'/g, "''")}', '${c.replace(/'/g, "''")}'), ` +
            `coalesce(max(${qi(c)}), 1), max(${qi(c)}) IS NOT NULL) FROM ${qname(t)};`,
        );
      }
      out.push('');
    }
    out.push('COMMIT;', '');
    return out.join('\n');
  });
}

export interface Manifest {
  format: 'candlewise-backup/1';
  createdAt: string;
  source: 'pglite' | 'postgres';
  files: { tarball?: string; sql: string };
  tables: Checksums;
}

/** `candlewise-20261202T061500Z` */
export function backupBaseName(now = new Date()) {
  return `candlewise-${now
    .toISOString()
    .replace(/[-:]/g, '')
    .replace(/\.\d+Z$/, 'Z')}`;
}

/** The manifest written beside a backup file, if there is one. */
export function manifestFor(file: string): Manifest | null {
  const base = file.replace(/\.(tar\.gz|sql)$/, '');
  const p = `${base}.manifest.json`;
  return fs.existsSync(p) ? (JSON.parse(fs.readFileSync(p, 'utf8')) as Manifest) : null;
}

/** Tables whose count or checksum differ between two sets, e.g. a manifest and a restored database. */
export function compareChecksums(expected: Checksums, actual: Checksums): string[] {
  const names = new Set([...Object.keys(expected), ...Object.keys(actual)]);
  const diffs: string[] = [];
  for (const n of [...names].sort()) {
    const e = expected[n];
    const a = actual[n];
    if (!e) diffs.push(`${n}: not in the backup`);
    else if (!a) diffs.push(`${n}: missing after restore`);
    else if (e.rows !== a.rows) diffs.push(`${n}: ${e.rows} rows saved, ${a.rows} restored`);
    else if (e.md5 !== a.md5) diffs.push(`${n}: same row count, different contents`);
  }
  return diffs;
}

export function snapshotterForPostgres(client: import('postgres').Sql): Snapshotter {
  return (fn) =>
    client.begin('isolation level repeatable read read only', async (tx) => {
      for (const s of SESSION_SETTINGS) await tx.unsafe(s);
      return fn(async (text) => (await tx.unsafe(text)) as unknown as Row[]);
    }) as never;
}
