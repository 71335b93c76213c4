// A child process for the reminder crash test: the job queue's worker on a PGlite directory, with
// the local mail fake in the same process (as in the server), killed with SIGKILL mid-run by the
// parent and started again.
//
//   node --import tsx --require ./tests/crash/server-only-off.js tests/crash/reminder-worker.ts prepare <dir> <members> <weekOf>
//       seed the demo club, add <members> members with reminders on and a Scots pine each, queue a run
//   node --import tsx --require ./tests/crash/server-only-off.js tests/crash/reminder-worker.ts work <dir> <smtpPort>
//       start the mail fake and the worker; print `progress <settled>` as members are settled,
//       `finished` when the run is
import fs from 'node:fs';
import path from 'node:path';
import { eq, isNotNull, sql } from 'drizzle-orm';
import { openDatabase } from '../../db/open';
import { setDbHandle } from '../../db/client';
import { reminderRunMembers, reminderRuns, trees, users } from '../../db/schema';
import { seed } from '../../db/seed';

const migrationsFolder = path.resolve(__dirname, '../../db/migrations');
const say = (line: string) => fs.writeSync(1, `${line}\n`);

async function prepare(dir: string, members: number, weekOf: string) {
  const handle = await openDatabase({ pgliteDir: dir, migrationsFolder });
  setDbHandle(handle);
  await seed(handle.db);
  for (let i = 0; i < members; i++) {
    const [u] = await handle.db
      .insert(users)
      .values({ email: `crash-remind-${i}@candlewise.test`, name: `Crash member ${i}`, reminderOptIn: true })
      .returning({ id: users.id });
    await handle.db.insert(trees).values({
      id: `crashtree${String(i).padStart(4, '0')}`,
      ownerId: u.id,
      name: `Crash pine ${i}`,
      speciesSlug: 'pinus-sylvestris',
      stageNotes: 'Refinement: tertiary branching on every pad.',
    });
  }
  const [admin] = await handle.db.select().from(users).where(eq(users.email, 'admin@candlewise.test'));
  const { startReminderRun } = await import('../../lib/data/reminders');
  const run = await startReminderRun({ id: admin.id, name: admin.name ?? '', email: admin.email, role: admin.role, tokenVersion: admin.tokenVersion }, weekOf);
  say(`prepared ${run.id}`);
  await handle.close();
}

async function work(dir: string, smtpPort: string) {
  const handle = await openDatabase({ pgliteDir: dir, migrationsFolder });
  setDbHandle(handle);
  const { startFakeSmtp } = await import('../../lib/mail/fake-smtp');
  await startFakeSmtp(Number(smtpPort));
  const { startWorker } = await import('../../lib/queue/worker');
  await startWorker({ pollMs: 50 });
  say('working');
  let last = -1;
  for (;;) {
    const [{ n }] = await handle.db
      .select({ n: sql<number>`count(*)::int` })
      .from(reminderRunMembers)
      .where(isNotNull(reminderRunMembers.outcome));
    const [{ total }] = await handle.db.select({ total: sql<number | null>`max(${reminderRuns.total})` }).from(reminderRuns);
    if (n !== last) say(`progress ${n}`);
    last = n;
    if (total !== null && n === total) {
      say('finished');
      break;
    }
    await new Promise((r) => setTimeout(r, 10));
  }
  await new Promise<void>((resolve) => process.once('SIGTERM', () => resolve()));
  process.exit(0);
}

async function main() {
  const [mode, dir, a, b] = process.argv.slice(2);
  if (mode === 'prepare') return prepare(dir, Number(a), b);
  return work(dir, a);
}

main().catch((e: Error) => {
  fs.writeSync(2, `${e.name}: ${e.message}\n${e.stack}\n`);
  process.exit(3);
});
