import { spawn, type ChildProcess } from 'node:child_process';
import path from 'node:path';

const root = path.resolve(__dirname, '../..');
export const writerScript = path.join(root, 'tests/crash/writer.ts');

/**
 * A writer child started as `node --import tsx` (not through the tsx CLI, which forks a second
 * process: SIGKILL on the CLI would orphan the real writer and keep it writing).
 */
export interface Child {
  proc: ChildProcess;
  lines: string[];
  stderr: () => string;
  /** Resolves with the first line that starts with `prefix`, or rejects if the child exits first. */
  waitFor(prefix: string, timeoutMs?: number): Promise<string>;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
}

export function startChild(args: string[], env: Record<string, string> = {}, script = writerScript, nodeArgs = ['--conditions=react-server']): Child {
  const proc = spawn(process.execPath, ['--import', 'tsx', ...nodeArgs, script, ...args], {
    cwd: root,
    env: { ...process.env, ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  const lines: string[] = [];
  let buf = '';
  let err = '';
  const waiters = new Set<() => void>();
  let done = false;
  proc.stdout!.setEncoding('utf8');
  proc.stdout!.on('data', (d: string) => {
    buf += d;
    let i: number;
    while ((i = buf.indexOf('\n')) >= 0) {
      lines.push(buf.slice(0, i));
      buf = buf.slice(i + 1);
    }
    for (const w of [...waiters]) w();
  });
  proc.stderr!.on('data', (d) => (err += d));
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) =>
    // 'close' (not 'exit') waits until stdout is drained, so `lines` holds everything printed.
    proc.once('close', (code, signal) => {
      done = true;
      for (const w of [...waiters]) w();
      resolve({ code, signal });
    }),
  );
  return {
    proc,
    lines,
    stderr: () => err,
    exited,
    waitFor(prefix, timeoutMs = 30_000) {
      return new Promise((resolve, reject) => {
        const timer = setTimeout(() => {
          waiters.delete(check);
          reject(new Error(`no "${prefix}" line within ${timeoutMs} ms; stderr: ${err}`));
        }, timeoutMs);
        const check = () => {
          const hit = lines.find((l) => l.startsWith(prefix));
          if (hit !== undefined || done) {
            clearTimeout(timer);
            waiters.delete(check);
            if (hit !== undefined) resolve(hit);
            else reject(new Error(`child exited before "${prefix}"; stderr: ${err}`));
          }
        };
        waiters.add(check);
        check();
      });
    },
  };
}

export async function killNow(child: Child) {
  if (child.proc.exitCode === null && child.proc.signalCode === null) child.proc.kill('SIGKILL');
  return child.exited;
}
