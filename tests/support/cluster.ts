import { execFileSync, spawnSync } from 'node:child_process';
import { randomBytes } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { freePort, spawnNext, type NextProcess } from './app-server';
import { startFakeS3, type FakeS3 } from './fake-s3';

// A small cluster on one machine, for `npm run demo:cluster` and the cluster test suite alike:
// a throwaway PostgreSQL server (Debian's server binaries, a fresh data directory under the
// system temp folder), the fake S3 server, and two `next start` processes of the built app on one
// DATABASE_URL, one bucket and one NEXTAUTH_SECRET. The database is migrated and seeded with the
// demo club once, before either process starts.

const root = path.resolve(__dirname, '../..');

interface Postgres {
  url: string;
  port: number;
  version: string;
  stop(): Promise<void>;
}

/** The directory holding initdb, pg_ctl and postgres: the one on PATH, else Debian's newest. */
function postgresBinDir(): string {
  const candidates: string[] = [];
  const onPath = spawnSync('sh', ['-c', 'command -v initdb'], { encoding: 'utf8' }).stdout.trim();
  // Resolve links: an initdb linked into /usr/local/bin has no pg_ctl beside it.
  if (onPath) candidates.push(path.dirname(fs.realpathSync(onPath)));
  const debian = '/usr/lib/postgresql';
  if (fs.existsSync(debian)) {
    const versions = fs.readdirSync(debian).sort((a, b) => Number(b) - Number(a));
    candidates.push(...versions.map((v) => path.join(debian, v, 'bin')));
  }
  const bin = candidates.find((d) => ['initdb', 'pg_ctl', 'postgres'].every((x) => fs.existsSync(path.join(d, x))));
  if (!bin) throw new Error('PostgreSQL server binaries not found: run scripts/setup.sh (it installs Debian’s postgresql).');
  return bin;
}

/**
 * A PostgreSQL server on 127.0.0.1 with a fresh data directory, trust authentication for the
 * `candlewise` role, and its own `postgres` database as the app's database. Started as root, it
 * runs as the `postgres` user (the server refuses to run as root).
 */
async function startPostgres(): Promise<Postgres> {
  const bin = postgresBinDir();
  const work = fs.mkdtempSync(path.join(os.tmpdir(), 'candlewise-cluster-pg-'));
  const port = await freePort();
  const asRoot = process.getuid?.() === 0;
  if (asRoot) execFileSync('chown', ['postgres', work]);
  const run = (tool: string, args: string[]) => {
    const [cmd, argv] = asRoot ? ['runuser', ['-u', 'postgres', '--', path.join(bin, tool), ...args]] : [path.join(bin, tool), args];
    const r = spawnSync(cmd, argv, { encoding: 'utf8' });
    if (r.status !== 0) throw new Error(`${tool} failed: ${r.stderr}${r.stdout}`);
    return r.stdout;
  };
  const data = path.join(work, 'data');
  const stop = async () => {
    if (fs.existsSync(path.join(data, 'postmaster.pid'))) {
      try {
        run('pg_ctl', ['-D', data, '-m', 'fast', '-w', 'stop']);
      } catch {
        /* already stopped */
      }
    }
    fs.rmSync(work, { recursive: true, force: true });
  };
  try {
    run('initdb', ['-D', data, '-U', 'candlewise', '--auth=trust', '-E', 'UTF8']);
    // fsync off: a throwaway server whose data nobody keeps.
    run('pg_ctl', ['-D', data, '-o', `-p ${port} -k ${work} -c listen_addresses=127.0.0.1 -c fsync=off`, '-l', path.join(work, 'log'), '-w', 'start']);
  } catch (e) {
    await stop();
    throw e;
  }
  const version = /\d+(\.\d+)+/.exec(run('pg_ctl', ['--version']))?.[0] ?? '';
  return { url: `postgres://candlewise@127.0.0.1:${port}/postgres`, port, version, stop };
}

interface ClusterApp extends NextProcess {
  name: 'A' | 'B';
  port: number;
}

export interface Cluster {
  a: ClusterApp;
  b: ClusterApp;
  postgres: Postgres;
  s3: FakeS3;
  /** The UPLOADS_DIR both apps are given; with S3 set, nothing may appear in it. */
  uploadsDir: string;
  /** Stops both apps, then the fake S3 server and PostgreSQL, and removes their directories. */
  stop(): Promise<void>;
}

export interface ClusterOptions {
  /** The two app ports; a spare port each when not given. */
  ports?: [number, number];
  /** Extra settings for both app processes. */
  env?: Record<string, string>;
  /** Called with each piece of a process's output (the demo prints it, prefixed). */
  onOutput?: (name: 'A' | 'B', chunk: string) => void;
  /** Called before each step (the demo prints them). */
  onStep?: (label: string) => void;
  /** Start the apps in their own process groups, so a terminal's Ctrl-C reaches only the parent. */
  detached?: boolean;
}

function portIsFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const srv = net.createServer();
    srv.once('error', () => resolve(false));
    srv.listen(port, '127.0.0.1', () => srv.close(() => resolve(true)));
  });
}

function tsxScript(script: string, env: Record<string, string>) {
  const r = spawnSync(path.join(root, 'node_modules/.bin/tsx'), ['--conditions=react-server', script], {
    cwd: root,
    env: env as NodeJS.ProcessEnv,
    encoding: 'utf8',
  });
  if (r.status !== 0) throw new Error(`${script} failed${r.signal ? ` (${r.signal})` : ''}: ${r.stderr}${r.stdout}`);
}

/**
 * Resolves once the process's cache-invalidation listener reports itself live on /api/health
 * (it hears its own notifications on PostgreSQL); until then a write through the other process
 * could go unheard.
 */
async function invalidationLive(app: NextProcess): Promise<void> {
  const deadline = Date.now() + 20_000;
  for (;;) {
    const health = (await (await fetch(`${app.url}/api/health`, { signal: AbortSignal.timeout(5000) })).json()) as { invalidation?: string };
    if (health.invalidation === 'live') return;
    if (Date.now() > deadline) throw new Error(`${app.url}: cache invalidation listener not live (${health.invalidation})`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

export async function startCluster(opts: ClusterOptions = {}): Promise<Cluster> {
  if (!fs.existsSync(path.join(root, '.next', 'BUILD_ID'))) {
    throw new Error('No build found: run `npm run build` first (the cluster starts the built app).');
  }
  const step = opts.onStep ?? (() => {});
  const stops: (() => Promise<void>)[] = [];
  const stopAll = async () => {
    // Newest first: the apps before the stores they use.
    for (const s of stops.splice(0).reverse()) await s().catch((e) => console.error(e));
  };
  try {
    // Before anything starts: a port taken by something else fails at once.
    const [portA, portB] = opts.ports ?? [await freePort(), await freePort()];
    for (const p of [portA, portB]) {
      if (!(await portIsFree(p))) throw new Error(`Port ${p} is in use: stop what holds it, or choose others with PORT_A and PORT_B.`);
    }
    step('PostgreSQL');
    const postgres = await startPostgres();
    stops.push(postgres.stop);
    step('fake S3');
    const s3 = await startFakeS3('candlewise-photos', await freePort());
    stops.push(s3.stop);
    // Nothing is written to local directories with DATABASE_URL and S3 set; these only keep the
    // defaults (./data) untouched should anything look at them.
    const scratch = fs.mkdtempSync(path.join(os.tmpdir(), 'candlewise-cluster-app-'));
    stops.push(async () => fs.rmSync(scratch, { recursive: true, force: true }));
    const shared: Record<string, string> = {
      ...(process.env as Record<string, string>),
      NODE_ENV: 'production',
      NEXT_TELEMETRY_DISABLED: '1',
      DATABASE_URL: postgres.url,
      PGLITE_DIR: path.join(scratch, 'pglite'),
      UPLOADS_DIR: path.join(scratch, 'uploads'),
      SECRET_FILE: path.join(scratch, 'secret'),
      S3_URL: s3.url,
      S3_BUCKET: s3.bucket,
      S3_ACCESS_KEY_ID: s3.accessKeyId,
      S3_SECRET_ACCESS_KEY: s3.secretAccessKey,
      S3_REGION: 'us-east-1',
      S3_PREFIX: '',
      // One secret for every process on the database: a session signed by one is good on the other.
      NEXTAUTH_SECRET: randomBytes(32).toString('base64url'),
      // Each process runs its own mail fake; both write the one outbox table.
      MAIL_FAKE: '1',
      SMTP_URL: '',
      ...opts.env,
    };
    step('migrate');
    tsxScript('scripts/db-migrate.ts', shared);
    step('seed the demo club');
    tsxScript('scripts/db-seed.ts', shared);

    const start = async (name: 'A' | 'B', port: number): Promise<ClusterApp> => {
      const env = { ...shared, PORT: String(port), NEXTAUTH_URL: `http://127.0.0.1:${port}`, SMTP_FAKE_PORT: String(await freePort()) };
      step(`app ${name} on port ${port}`);
      const app = await spawnNext({ port, env, detached: opts.detached, onOutput: opts.onOutput && ((c) => opts.onOutput!(name, c)) });
      stops.push(app.stop);
      return { ...app, name, port };
    };
    // One after the other: both run the (already applied) migrations check at start.
    const a = await start('A', portA);
    const b = await start('B', portB);
    step('waiting for both processes to hear cache invalidations');
    await Promise.all([a, b].map(invalidationLive));
    return { a, b, postgres, s3, uploadsDir: shared.UPLOADS_DIR, stop: stopAll };
  } catch (e) {
    await stopAll();
    throw e;
  }
}
