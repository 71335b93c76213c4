import { spawn, spawnSync, type ChildProcess } from 'node:child_process';
import fs from 'node:fs';
import { randomBytes } from 'node:crypto';
import path from 'node:path';
import { freePort } from '../tests/support/app-server';

// The built app on a free local port, on its own PGlite directory. The benchmark builds nothing.
const root = path.resolve(__dirname, '..');

export interface BenchServer {
  url: string;
  proc: ChildProcess;
  /** ms from spawn to the first 200 on /api/health */
  startedInMs: number;
  stop(): Promise<void>;
}

function benchEnv(dataDir: string, port: number): NodeJS.ProcessEnv {
  return {
    ...process.env,
    NODE_ENV: 'production',
    NEXT_TELEMETRY_DISABLED: '1',
    PGLITE_DIR: path.join(dataDir, 'pglite'),
    UPLOADS_DIR: path.join(dataDir, 'uploads'),
    DATABASE_URL: '',
    PORT: String(port),
    NEXTAUTH_URL: `http://127.0.0.1:${port}`,
    NEXTAUTH_SECRET: randomBytes(32).toString('base64url'),
    MAIL_FAKE: '0',
    // The soak saves thousands of answers as one member.
    ANSWER_QUOTA: process.env.ANSWER_QUOTA ?? '10000000',
    SMTP_URL: 'smtp://127.0.0.1:9',
  };
}

export function assertBuilt() {
  if (!fs.existsSync(path.join(root, '.next', 'BUILD_ID'))) {
    throw new Error('No build found: run `npm run build` first (the benchmark builds nothing itself).');
  }
}

export function seedDemo(dataDir: string) {
  const r = spawnSync(path.join(root, 'node_modules/.bin/tsx'), ['--conditions=react-server', 'scripts/db-seed.ts'], {
    cwd: root,
    env: benchEnv(dataDir, 3000),
    encoding: 'utf8',
  });
  if (r.status !== 0) throw new Error(`seed failed: ${r.stderr}${r.stdout}`);
}

/** BENCH_PORT pins the port (on a shared machine each engineer has a range); else any free one. */
export async function startServer(dataDir: string): Promise<BenchServer> {
  const port = process.env.BENCH_PORT ? Number(process.env.BENCH_PORT) : await freePort();
  const url = `http://127.0.0.1:${port}`;
  const t0 = performance.now();
  const proc = spawn(path.join(root, 'node_modules/.bin/next'), ['start', '--hostname', '127.0.0.1', '--port', String(port)], {
    cwd: root,
    env: benchEnv(dataDir, port),
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  proc.stdout!.on('data', (d) => (output += d));
  proc.stderr!.on('data', (d) => (output += d));
  const deadline = Date.now() + 60_000;
  for (;;) {
    if (proc.exitCode !== null) throw new Error(`server exited early:\n${output}`);
    try {
      const res = await fetch(`${url}/api/health`);
      await res.body?.cancel();
      if (res.status === 200) break;
    } catch {
      /* not listening yet */
    }
    if (Date.now() > deadline) throw new Error(`server did not start:\n${output}`);
    await new Promise((r) => setTimeout(r, 10));
  }
  const startedInMs = performance.now() - t0;
  return {
    url,
    proc,
    startedInMs,
    stop: async () => {
      if (proc.exitCode !== null) return;
      const exited = new Promise((r) => proc.once('exit', r));
      proc.kill('SIGTERM');
      await Promise.race([exited, new Promise((r) => setTimeout(r, 10_000))]);
      if (proc.exitCode === null) proc.kill('SIGKILL');
    },
  };
}
