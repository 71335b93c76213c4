// A child process for the crash-safety suite. It opens a PGlite directory through db/open.ts
// (lock, interrupted-initialisation marker, migrations), reports what it finds, then writes
// answers — in turn through the data layer's saveAnswer (the wizard's own write) and as
// multi-row transactions — printing one `ack` line per commit the database confirmed.
// The parent kills it with SIGKILL at random moments and checks the next opening.
//
//   tsx --conditions=react-server tests/crash/writer.ts write <dir> <cycle>
//   tsx --conditions=react-server tests/crash/writer.ts hold <dir>        (open, print ready, wait)
//   tsx --conditions=react-server tests/crash/writer.ts open <dir>        (open, report, exit)
import fs from 'node:fs';
import path from 'node:path';
import { sql } from 'drizzle-orm';
import { openDatabase, type Db } from '../../db/open';
import { setDbHandle } from '../../db/client';
import { answers, species, users } from '../../db/schema';
import { seed } from '../../db/seed';
import type { WizardInput, WizardResult } from '../../lib/wizard/types';

const CRASH_USER_ID = 'crash-writer-user';
const migrationsFolder = path.resolve(__dirname, '../../db/migrations');

// Synchronous writes to fd 1: a line is out of the process before the next statement runs,
// so an `ack` the parent reads was printed after the commit returned, never before.
const say = (line: string) => fs.writeSync(1, `${line}\n`);

async function ensureUser(db: Db) {
  await db.insert(users).values({ id: CRASH_USER_ID, email: 'crash-writer@candlewise.test', name: 'Crash writer' }).onConflictDoNothing();
}

/** What is on disk now: every answer id, and the same count read by an index scan and a heap scan. */
async function report(db: Db) {
  const rows = await db
    .select({ id: answers.id })
    .from(answers)
    .where(sql`${answers.userId} = ${CRASH_USER_ID}`);
  const count = async (...settings: string[]) => {
    const [r] = await db.transaction(async (tx) => {
      for (const s of settings) await tx.execute(sql.raw(s));
      return tx
        .select({ n: sql<number>`count(*)::int` })
        .from(answers)
        .where(sql`${answers.userId} = ${CRASH_USER_ID}`);
    });
    return r.n;
  };
  const viaIndex = await count('SET LOCAL enable_seqscan = off');
  const viaHeap = await count('SET LOCAL enable_indexscan = off', 'SET LOCAL enable_bitmapscan = off');
  say(`scan ${viaIndex} ${viaHeap}`);
  say(`have ${rows.map((r) => r.id).join(',')}`);
}

function answerRow(id: string) {
  return {
    id,
    userId: CRASH_USER_ID,
    speciesSlug: 'pinus-thunbergii',
    speciesRevision: 1,
    engineVersion: 'crash-test',
    action: 'pinch',
    stage: 'refinement',
    season: 'spring',
    observedOn: '2026-05-01',
    // Not a real evaluation: rows of a known size for the crash checks (jsonb of any shape).
    input: { candleLengthCm: 6, note: 'x'.repeat(200) } as unknown as WizardInput,
    result: { action: 'pinch' } as unknown as WizardResult,
  };
}

const crashUser = { id: CRASH_USER_ID, name: 'Crash writer', email: 'crash-writer@candlewise.test', role: 'member' as const, tokenVersion: 0 };

async function write(db: Db, cycle: string) {
  await ensureUser(db);
  const { saveAnswer } = await import('../../lib/data/answers');
  const [sp] = await db
    .select({ slug: species.slug })
    .from(species)
    .where(sql`${species.publishedRevision} is not null`)
    .limit(1);
  const body = { species: sp.slug, branching: 'tertiary', date: '2026-06-15', shoot: 'candle-extending', position: 'at-silhouette', health: 'strong' } as const;
  say('writing');
  for (let n = 0; ; n++) {
    if (n % 2 === 0) {
      // The wizard's own write: one answer, id chosen by the data layer.
      const saved = await saveAnswer(crashUser, { ...body, note: `cycle ${cycle}` });
      say(`ack1 ${saved.id}`);
      continue;
    }
    // A commit of one to three rows: all of a group or none of it may survive a kill.
    const size = 1 + (n % 3);
    const group = `c${cycle}-${n}`;
    await db.transaction(async (tx) => {
      for (let i = 0; i < size; i++) await tx.insert(answers).values(answerRow(`${group}-${i}`));
    });
    say(`ack ${group} ${size}`);
  }
}

async function main() {
  const [mode, dir, cycle = '0'] = process.argv.slice(2);
  const handle = await openDatabase({ pgliteDir: dir, migrationsFolder });
  setDbHandle(handle);
  say(`ready ${process.pid}`);
  if (mode === 'open') {
    // The demo data (species above all, which the wizard reads) on a new directory.
    const [any] = await handle.db.select({ id: species.id }).from(species).limit(1);
    if (!any) await seed(handle.db);
    await ensureUser(handle.db);
    await report(handle.db);
    await handle.close();
    return;
  }
  if (mode === 'hold') {
    await new Promise<void>((resolve) => process.once('SIGTERM', () => resolve()));
    await handle.close();
    return;
  }
  await report(handle.db);
  await write(handle.db, cycle);
}

main().catch((e: Error) => {
  fs.writeSync(2, `${e.name}: ${e.message}\n`);
  process.exit(3);
});
