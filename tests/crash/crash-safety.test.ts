import { afterAll, describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { killNow, startChild, type Child } from './child';

// Crash safety of the PGlite data directory, from real child processes killed with SIGKILL.
// CRASH_CYCLES (default 50; `npm run bench:crash` uses 200) and CRASH_SEED make a run repeatable.
const CYCLES = Number(process.env.CRASH_CYCLES ?? 50);
const SEED = Number(process.env.CRASH_SEED ?? Date.now() % 1_000_000);

/** mulberry32: a small seeded generator, so a failing run can be replayed with CRASH_SEED. */
function rng(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const dirs: string[] = [];
const tmpDir = () => {
  const d = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-crash-'));
  dirs.push(d);
  return path.join(d, 'pglite');
};
const children: Child[] = [];
const spawnWriter = (args: string[]) => {
  const c = startChild(args);
  children.push(c);
  return c;
};
afterAll(async () => {
  for (const c of children) await killNow(c);
  for (const d of dirs) fs.rmSync(d, { recursive: true, force: true });
});

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Group `c<cycle>-<n>` holds 1 + n % 3 rows, ids `<group>-0` … (see writer.ts). */
const groupSize = (group: string) => 1 + (Number(group.split('-')[1]) % 3);

interface Snapshot {
  ids: Set<string>;
  viaIndex: number;
  viaHeap: number;
}

function snapshotOf(child: Child): Snapshot | null {
  const have = child.lines.find((l) => l.startsWith('have '));
  const scan = child.lines.find((l) => l.startsWith('scan '));
  if (have === undefined || scan === undefined) return null;
  const list = have.slice(5).trim();
  const [viaIndex, viaHeap] = scan.split(' ').slice(1).map(Number);
  return { ids: new Set(list ? list.split(',') : []), viaIndex, viaHeap };
}

const GROUP_ROW = /^c\d+-\d+-\d+$/;

function checkSnapshot(snap: Snapshot, acked: Map<string, number>, singles: Set<string>, where: string) {
  // Every acknowledged commit survived …
  const lost = [...acked].flatMap(([g, size]) => Array.from({ length: size }, (_, i) => `${g}-${i}`)).filter((id) => !snap.ids.has(id));
  expect(lost, `${where}: acknowledged rows missing`).toEqual([]);
  const lostSingles = [...singles].filter((id) => !snap.ids.has(id));
  expect(lostSingles, `${where}: acknowledged saveAnswer rows missing`).toEqual([]);
  // … no commit survived in part …
  const groups = new Map<string, number>();
  for (const id of snap.ids) {
    if (!GROUP_ROW.test(id)) continue;
    const g = id.slice(0, id.lastIndexOf('-'));
    groups.set(g, (groups.get(g) ?? 0) + 1);
  }
  const torn = [...groups].filter(([g, n]) => n !== groupSize(g));
  expect(torn, `${where}: partly committed transactions`).toEqual([]);
  // … and the index agrees with the table.
  expect(snap.viaIndex, `${where}: index scan count`).toBe(snap.ids.size);
  expect(snap.viaHeap, `${where}: heap scan count`).toBe(snap.ids.size);
}

describe('crash safety of the data directory', () => {
  it(
    `keeps every acknowledged commit through ${CYCLES} SIGKILLs at random moments (seed ${SEED})`,
    async () => {
      const random = rng(SEED);
      const dir = tmpDir();
      // The first open initialises the directory; the cycles then reuse it (an existing directory
      // opens in about a second, a fresh one takes three).
      const init = spawnWriter(['open', dir]);
      expect((await init.exited).code, init.stderr()).toBe(0);

      const acked = new Map<string, number>();
      const singles = new Set<string>();
      let killedWhileOpening = 0;
      let killedWhileWriting = 0;
      let verified = 0;
      const started = Date.now();
      for (let cycle = 1; cycle <= CYCLES; cycle++) {
        const child = spawnWriter(['write', dir, String(cycle)]);
        if (random() < 0.2) {
          // Kill somewhere in start-up: module loading, recovery, migrations check, the report.
          await sleep(random() * 1500);
          killedWhileOpening++;
        } else {
          await child.waitFor('writing');
          await sleep(random() * 300);
          killedWhileWriting++;
        }
        const exit = await killNow(child);
        // The child never fails on its own: an error exit means the directory did not open cleanly.
        expect(exit.code, `cycle ${cycle}: ${child.stderr()}`).toBe(null);
        expect(exit.signal).toBe('SIGKILL');

        const snap = snapshotOf(child);
        if (snap) {
          checkSnapshot(snap, acked, singles, `cycle ${cycle}`);
          verified++;
        }
        for (const l of child.lines) {
          const m = /^ack (\S+) (\d+)$/.exec(l);
          if (m) acked.set(m[1], Number(m[2]));
          const one = /^ack1 (\S+)$/.exec(l);
          if (one) singles.add(one[1]);
        }
      }

      // A final, orderly open: it must succeed and hold every acknowledged commit.
      const last = spawnWriter(['open', dir]);
      expect((await last.exited).code, last.stderr()).toBe(0);
      const snap = snapshotOf(last);
      expect(snap).not.toBeNull();
      checkSnapshot(snap!, acked, singles, 'final open');
      expect(acked.size).toBeGreaterThan(CYCLES);
      expect(singles.size).toBeGreaterThan(CYCLES);
      console.log(
        `[crash] ${CYCLES} cycles in ${((Date.now() - started) / 1000).toFixed(1)} s (seed ${SEED}): ` +
          `${killedWhileOpening} kills while opening, ${killedWhileWriting} while writing, ` +
          `${verified} reopenings checked, ${acked.size + singles.size} acknowledged commits ` +
          `(${singles.size} through saveAnswer), ${snap!.ids.size} rows on disk`,
      );
    },
    CYCLES * 10_000 + 60_000,
  );

  it('reports an interrupted first initialisation clearly on the next start', async () => {
    const random = rng(SEED + 1);
    const dir = tmpDir();
    const marker = `${dir}.initialising`;
    const first = spawnWriter(['open', dir]);
    // Wait until initialisation has begun (the marker is written just before PGlite's initdb),
    // then kill it part-way.
    for (let i = 0; !fs.existsSync(marker); i++) {
      if (i > 600) throw new Error(`no .initialising marker appeared; stderr: ${first.stderr()}`);
      if (first.proc.exitCode !== null) throw new Error(`child exited before initialising: ${first.stderr()}`);
      await sleep(10);
    }
    await sleep(random() * 400);
    await killNow(first);
    expect(
      first.lines.some((l) => l.startsWith('ready')),
      'the kill came after initialisation finished',
    ).toBe(false);
    expect(fs.existsSync(marker)).toBe(true);

    // The next opener — the data layer in a fresh process — refuses with the clear error …
    const second = spawnWriter(['open', dir]);
    const exit = await second.exited;
    expect(exit.code).toBe(3);
    expect(second.stderr()).toContain('InterruptedInitError');
    expect(second.stderr()).toContain('half-initialised');
    expect(second.stderr()).toContain(dir);
    // … and so does the migrate command a club would run next.
    const migrate = startMigrate(dir);
    const m = await migrate.done;
    expect(m.code).toBe(1);
    expect(m.output).toContain('half-initialised');
    expect(m.output).toContain('remove the directory');

    // Following the advice gives a working directory.
    fs.rmSync(dir, { recursive: true, force: true });
    fs.rmSync(marker, { force: true });
    const third = spawnWriter(['open', dir]);
    expect((await third.exited).code, third.stderr()).toBe(0);
  }, 90_000);

  it('refuses a second process on the same directory with a clear message', async () => {
    const dir = tmpDir();
    const holder = spawnWriter(['hold', dir]);
    const ready = await holder.waitFor('ready');
    const holderPid = ready.split(' ')[1];

    const intruder = spawnWriter(['open', dir]);
    expect((await intruder.exited).code).toBe(3);
    expect(intruder.stderr()).toContain('DataDirLockedError');
    expect(intruder.stderr()).toContain(`already in use by process ${holderPid}`);
    expect(intruder.lines.some((l) => l.startsWith('ready'))).toBe(false);

    // An orderly stop releases the lock; the next process opens the directory.
    holder.proc.kill('SIGTERM');
    expect((await holder.exited).code).toBe(0);
    expect(fs.existsSync(`${dir}.lock`)).toBe(false);
    const next = spawnWriter(['open', dir]);
    expect((await next.exited).code, next.stderr()).toBe(0);
  }, 90_000);
});

function startMigrate(dir: string) {
  const root = path.resolve(__dirname, '../..');
  const proc = spawn(process.execPath, ['--import', 'tsx', '--conditions=react-server', 'scripts/db-migrate.ts'], {
    cwd: root,
    env: { ...process.env, PGLITE_DIR: dir, DATABASE_URL: '' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  proc.stdout.on('data', (d) => (output += d));
  proc.stderr.on('data', (d) => (output += d));
  return { done: new Promise<{ code: number | null; output: string }>((r) => proc.once('close', (code) => r({ code, output }))) };
}
