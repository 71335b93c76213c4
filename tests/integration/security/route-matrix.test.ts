import { describe, expect, inject, it } from 'vitest';
import fs from 'node:fs';
import path from 'node:path';
import { ACTORS, Fixtures } from './fixtures';
import { routeMatrix, sendRow, statusOk } from './route-matrix';

const base = inject('baseUrl');
const f = new Fixtures(base);
const root = path.resolve(__dirname, '../../..');

function walk(dir: string, out: string[] = []) {
  for (const e of fs.readdirSync(dir, { withFileTypes: true })) {
    const p = path.join(dir, e.name);
    if (e.isDirectory()) walk(p, out);
    else out.push(path.relative(root, p).split(path.sep).join('/'));
  }
  return out;
}

const METHODS = ['GET', 'POST', 'PUT', 'PATCH', 'DELETE', 'HEAD', 'OPTIONS'];

/** The HTTP methods a route.ts exports (`export const GET`, `export async function POST`, `export { h as GET }`). */
export function exportedMethods(source: string): string[] {
  const found = new Set<string>();
  for (const m of source.matchAll(/export\s+(?:const|let|async\s+function|function)\s+([A-Z]+)\b/g)) found.add(m[1]);
  for (const block of source.matchAll(/export\s*\{([^}]*)\}/g)) {
    for (const m of block[1].matchAll(/(?:\bas\s+)?\b([A-Z]+)\b\s*(?:,|$)/g)) found.add(m[1]);
  }
  return [...found].filter((m) => METHODS.includes(m)).sort();
}

/** Exported functions of modules marked 'use server' (server actions are public POST endpoints). */
function serverActions(files: string[]) {
  const out: string[] = [];
  for (const file of files) {
    if (!/\.(ts|tsx)$/.test(file)) continue;
    const src = fs.readFileSync(path.join(root, file), 'utf8');
    if (!/^\s*['"]use server['"]/m.test(src)) continue;
    for (const m of src.matchAll(/export\s+(?:async\s+)?(?:function\s+|const\s+)([A-Za-z0-9_]+)/g)) out.push(`${file}#${m[1]}`);
  }
  return out.sort();
}

describe('the route matrix', () => {
  it('lists every route handler, page and server action in app/ (and nothing that is gone)', () => {
    const files = [...walk(path.join(root, 'app')), ...walk(path.join(root, 'lib')), ...walk(path.join(root, 'components'))];
    const handlers = files
      .filter((p) => /^app\/.*route\.ts$/.test(p))
      .flatMap((file) => exportedMethods(fs.readFileSync(path.join(root, file), 'utf8')).map((m) => `${m} ${file}`));
    const pages = files.filter((p) => /^app\/.*page\.tsx$/.test(p)).map((file) => `GET ${file}`);
    const actions = serverActions(files).map((a) => `POST ${a}`);

    const listed = new Set(routeMatrix.map((r) => (r.kind === 'action' ? `POST ${r.file}` : `${r.method} ${r.file}`)));
    const inApp = [...handlers, ...pages, ...actions];
    expect(
      inApp.filter((x) => !listed.has(x)),
      'handlers, pages or actions without a row',
    ).toEqual([]);
    expect(
      [...listed].filter((x) => !inApp.includes(x)),
      'rows for code that no longer exists',
    ).toEqual([]);
    expect(new Set(routeMatrix.map((r) => r.route)).size, 'duplicate rows').toBe(routeMatrix.length);
  });

  it('gives each actor the status the matrix names, on every row', async () => {
    const failures: string[] = [];
    for (const row of routeMatrix) {
      for (const actor of ACTORS) {
        const res = await sendRow(f, row, actor);
        if (!statusOk(row.expect[actor], res.status)) {
          failures.push(`${row.route} as ${actor}: got ${res.status}, want ${row.expect[actor]} — ${(await res.text()).slice(0, 160)}`);
        }
        await res.body?.cancel().catch(() => {});
      }
    }
    expect(failures).toEqual([]);
  }, 300_000);

  // The 2025 middleware-bypass pattern: the header Next.js used internally to mark its own
  // subrequests. Authorization lives in the handlers and the data layer, so it must change nothing.
  // Every refused cell is tried with every value (that is where a bypass would show); every
  // allowed cell with one of them, in turn.
  const bypassValues = ['middleware', 'src/middleware', 'middleware:middleware:middleware:middleware:middleware', 'proxy'];
  const refused = (s: unknown) => [401, 403, 404, 307].some((x) => statusOk(s as number, x));

  it('gives the same statuses with x-middleware-subrequest headers', async () => {
    const tasks: { row: (typeof routeMatrix)[number]; actor: (typeof ACTORS)[number]; value: string }[] = [];
    let turn = 0;
    for (const row of routeMatrix) {
      for (const actor of ACTORS) {
        const values = refused(row.expect[actor]) ? bypassValues : [bypassValues[turn++ % bypassValues.length]];
        for (const value of values) tasks.push({ row, actor, value });
      }
    }
    const failures: string[] = [];
    await pool(tasks, 4, async ({ row, actor, value }) => {
      const res = await sendRow(f, row, actor, { 'x-middleware-subrequest': value });
      if (!statusOk(row.expect[actor], res.status)) failures.push(`${row.route} as ${actor} with "${value}": got ${res.status}, want ${row.expect[actor]}`);
      await res.body?.cancel().catch(() => {});
    });
    expect(failures.sort()).toEqual([]);
  }, 600_000);
});

/** Run `fn` over `items`, at most `n` at a time. */
export async function pool<T>(items: T[], n: number, fn: (item: T) => Promise<void>) {
  let next = 0;
  await Promise.all(
    Array.from({ length: Math.min(n, items.length) }, async () => {
      while (next < items.length) await fn(items[next++]);
    }),
  );
}
