import { describe, expect, it } from 'vitest';
import { spawn } from 'node:child_process';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { lockPathFor } from '@/db/lock';

const root = path.resolve(__dirname, '../..');

function hold(dir: string) {
  const child = spawn(path.join(root, 'node_modules/.bin/tsx'), ['--conditions=react-server', 'tests/fixtures/hold-database.ts'], {
    cwd: root,
    env: { ...process.env, PGLITE_DIR: dir, DATABASE_URL: '', NODE_ENV: 'test' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let out = '';
  child.stdout.on('data', (d) => (out += d));
  child.stderr.on('data', (d) => (out += d));
  const ready = new Promise<void>((resolve, reject) => {
    child.stdout.on('data', () => out.includes('ready') && resolve());
    child.on('exit', (code) => reject(new Error(`exited ${code}: ${out}`)));
  });
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  return { child, ready, exited, output: () => out };
}

describe('database shutdown', () => {
  it('closes PGlite and releases the lock on SIGTERM, and a second process is refused meanwhile', async () => {
    const dir = path.join(fs.mkdtempSync(path.join(os.tmpdir(), 'cw-shutdown-')), 'pglite');
    const first = hold(dir);
    await first.ready;
    // tsx runs the script in a child process of its own: the lock names that process.
    expect(fs.readFileSync(lockPathFor(dir), 'utf8')).toMatch(/^\d+$/);

    const second = hold(dir);
    second.ready.catch(() => {});
    expect(await second.exited).toBe(3);
    expect(second.output()).toMatch(/already in use by process \d+/);

    first.child.kill('SIGTERM');
    expect(await first.exited).toBe(0);
    expect(fs.existsSync(lockPathFor(dir))).toBe(false);

    // The directory opens cleanly again afterwards.
    const third = hold(dir);
    await third.ready;
    third.child.kill('SIGINT');
    expect(await third.exited).toBe(130);
  }, 90_000);
});
