import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import net from 'node:net';
import { randomBytes } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';

function listenOn(port: number): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.unref();
    srv.on('error', reject);
    srv.listen(port, '127.0.0.1', () => {
      const { port: got } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(got));
    });
  });
}

const claimed = new Set<number>();

/** A free port: any the system gives, or one in TEST_PORT_RANGE (e.g. `3100-3199`) on a shared machine. */
export async function freePort(): Promise<number> {
  const range = /^(\d+)-(\d+)$/.exec(process.env.TEST_PORT_RANGE ?? '');
  if (!range) return listenOn(0);
  for (let p = Number(range[1]); p <= Number(range[2]); p++) {
    if (claimed.has(p)) continue;
    try {
      await listenOn(p);
      claimed.add(p);
      return p;
    } catch {}
  }
  throw new Error(`No free port in TEST_PORT_RANGE ${process.env.TEST_PORT_RANGE}`);
}

export interface RunningApp {
  url: string;
  port: number;
  smtpPort: number;
  dataDir: string;
  process: ChildProcess;
  log: () => string;
  stop: () => Promise<void>;
}

const root = path.resolve(__dirname, '../..');

/** Seed a fresh database (PGlite directory, or DATABASE_URL when given) and start the built app. */
export async function startApp(opts: { databaseUrl?: string; env?: Record<string, string> } = {}): Promise<RunningApp> {
  if (!fs.existsSync(path.join(root, '.next', 'BUILD_ID'))) {
    throw new Error('No build found: run `npm run build` before the integration and e2e tests.');
  }
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'candlewise-test-'));
  const port = await freePort();
  const smtpPort = await freePort();
  const env: Record<string, string> = {
    ...(process.env as Record<string, string>),
    NODE_ENV: 'production',
    NEXT_TELEMETRY_DISABLED: '1',
    PGLITE_DIR: path.join(dataDir, 'pglite'),
    UPLOADS_DIR: path.join(dataDir, 'uploads'),
    DATABASE_URL: opts.databaseUrl ?? '',
    PORT: String(port),
    NEXTAUTH_URL: `http://127.0.0.1:${port}`,
    // A fresh random secret per server: no value in the repository signs anything.
    NEXTAUTH_SECRET: randomBytes(32).toString('base64url'),
    SMTP_FAKE_PORT: String(smtpPort),
    MAIL_FAKE: '1',
    SMTP_URL: '',
    // The shared test server signs up far more members from one address than any club would.
    SIGNUPS_PER_CLIENT_PER_HOUR: '100000',
    ...opts.env,
  };
  const seed = spawnSync(path.join(root, 'node_modules/.bin/tsx'), ['--conditions=react-server', 'scripts/db-seed.ts'], {
    cwd: root,
    env: env as NodeJS.ProcessEnv,
    encoding: 'utf8',
  });
  if (seed.status !== 0) throw new Error(`seed failed: ${seed.stderr}${seed.stdout}`);

  const server = await spawnNext({ port, env });
  return {
    url: server.url,
    port,
    smtpPort,
    dataDir,
    process: server.process,
    log: server.log,
    stop: async () => {
      await server.stop();
      fs.rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

export interface NextProcess {
  url: string;
  process: ChildProcess;
  log: () => string;
  stop: () => Promise<void>;
}

/**
 * `next start` of the built app on 127.0.0.1:`port` with `env` (which must name its own
 * SMTP_FAKE_PORT); resolves once /api/health answers and the mail fake listens. `onOutput`
 * sees the server's output as it comes (the cluster demo prints it).
 */
export async function spawnNext(opts: {
  port: number;
  env: Record<string, string>;
  onOutput?: (chunk: string) => void;
  detached?: boolean;
}): Promise<NextProcess> {
  let output = '';
  const child = spawn(path.join(root, 'node_modules/.bin/next'), ['start', '--hostname', '127.0.0.1', '--port', String(opts.port)], {
    cwd: root,
    env: opts.env as NodeJS.ProcessEnv,
    stdio: ['ignore', 'pipe', 'pipe'],
    // Its own process group: a Ctrl-C in the terminal reaches the parent, which stops it in turn.
    detached: opts.detached ?? false,
  });
  const keep = (d: Buffer) => {
    output += d;
    opts.onOutput?.(String(d));
  };
  child.stdout!.on('data', keep);
  child.stderr!.on('data', keep);
  const url = `http://127.0.0.1:${opts.port}`;
  const stop = async () => {
    if (child.exitCode === null && child.signalCode === null) {
      const exited = new Promise((r) => child.once('exit', r));
      child.kill('SIGTERM');
      await Promise.race([exited, new Promise((r) => setTimeout(r, 5000))]);
      if (child.exitCode === null && child.signalCode === null) child.kill('SIGKILL');
    }
  };
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (child.exitCode !== null || child.signalCode !== null) throw new Error(`server exited early:\n${output}`);
    try {
      // Bounded: whatever else holds the port may never answer.
      const res = await fetch(`${url}/api/health`, { signal: AbortSignal.timeout(2000) });
      if (res.ok && output.includes('mail fake listening')) break;
    } catch {
      /* not up yet */
    }
    if (Date.now() > deadline) {
      await stop();
      throw new Error(`server did not start:\n${output}`);
    }
    await new Promise((r) => setTimeout(r, 150));
  }
  return { url, process: child, log: () => output, stop };
}
