import { afterAll, describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import { randomBytes } from 'node:crypto';
import os from 'node:os';
import path from 'node:path';
import { freePort } from '../support/app-server';
import { killNow, startChild, type Child } from '../crash/child';

// The built app itself (next start), on a data directory it must not use: one whose first
// initialisation was killed half-way, and one another process holds. It must say so and stop,
// not crash on a request or split the data.
const root = path.resolve(__dirname, '../..');
const work = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-refuse-'));
const children: Child[] = [];
afterAll(async () => {
  for (const c of children) await killNow(c);
  fs.rmSync(work, { recursive: true, force: true });
});

async function startApp(pgliteDir: string) {
  const port = await freePort();
  const proc = spawn(path.join(root, 'node_modules/.bin/next'), ['start', '--hostname', '127.0.0.1', '--port', String(port)], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      NEXT_TELEMETRY_DISABLED: '1',
      PGLITE_DIR: pgliteDir,
      DATABASE_URL: '',
      NEXTAUTH_URL: `http://127.0.0.1:${port}`,
      NEXTAUTH_SECRET: randomBytes(32).toString('base64url'),
      MAIL_FAKE: '0',
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  proc.stdout.on('data', (d) => (output += d));
  proc.stderr.on('data', (d) => (output += d));
  const code = await new Promise<number | null>((resolve) => {
    const timer = setTimeout(() => {
      proc.kill('SIGKILL');
      resolve(null);
    }, 60_000);
    proc.once('exit', (c) => {
      clearTimeout(timer);
      resolve(c);
    });
  });
  return { code, output };
}

describe('the app at start-up', () => {
  it('stops with a clear message on a directory whose first initialisation was interrupted', async () => {
    const dir = path.join(work, 'interrupted', 'pglite');
    const child = startChild(['open', dir]);
    children.push(child);
    for (let i = 0; !fs.existsSync(`${dir}.initialising`); i++) {
      if (i > 600 || child.proc.exitCode !== null) throw new Error(`no initialisation began: ${child.stderr()}`);
      await new Promise((r) => setTimeout(r, 10));
    }
    await new Promise((r) => setTimeout(r, 200));
    await killNow(child);
    expect(child.lines.some((l) => l.startsWith('ready'))).toBe(false);

    const app = await startApp(dir);
    expect(app.code).toBe(1);
    expect(app.output).toContain('[candlewise]');
    expect(app.output).toContain('half-initialised');
    expect(app.output).toContain(dir);
  }, 120_000);

  it('stops with a clear message while another process holds the directory', async () => {
    const dir = path.join(work, 'held', 'pglite');
    const holder = startChild(['hold', dir]);
    children.push(holder);
    const pid = (await holder.waitFor('ready', 60_000)).split(' ')[1];
    const app = await startApp(dir);
    expect(app.code).toBe(1);
    expect(app.output).toContain(`already in use by process ${pid}`);
    // The holder was not disturbed: it still owns the lock and stops cleanly.
    expect(fs.readFileSync(`${dir}.lock`, 'utf8').trim()).toBe(pid);
    holder.proc.kill('SIGTERM');
    expect((await holder.exited).code).toBe(0);
  }, 120_000);
});
