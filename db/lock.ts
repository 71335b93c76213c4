import fs from 'node:fs';
import path from 'node:path';

// PGlite takes no lock of its own: two processes on one directory silently split the data.
// A lock file beside the directory, holding the owner's PID, makes the second opener fail fast.

export class DataDirLockedError extends Error {
  constructor(dir: string, pid: number) {
    super(
      `The data directory ${dir} is already in use by process ${pid}. ` +
        'Only one Candlewise process may open a PGlite directory at a time: stop the other process, ' +
        'or point PGLITE_DIR at another directory.',
    );
    this.name = 'DataDirLockedError';
  }
}

function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (e) {
    return (e as NodeJS.ErrnoException).code === 'EPERM';
  }
}

const held = new Set<string>();

export function lockPathFor(dir: string) {
  return `${path.resolve(dir)}.lock`;
}

/** Take the lock or throw DataDirLockedError. Returns a release function. */
export function acquireDirLock(dir: string): () => void {
  const lockPath = lockPathFor(dir);
  fs.mkdirSync(path.dirname(lockPath), { recursive: true });
  for (let attempt = 0; attempt < 3; attempt++) {
    try {
      const fd = fs.openSync(lockPath, 'wx');
      fs.writeSync(fd, String(process.pid));
      fs.fsyncSync(fd);
      fs.closeSync(fd);
      held.add(lockPath);
      let released = false;
      const release = () => {
        if (released) return;
        released = true;
        held.delete(lockPath);
        try {
          if (fs.readFileSync(lockPath, 'utf8').trim() === String(process.pid)) fs.unlinkSync(lockPath);
        } catch {
          /* already gone */
        }
      };
      process.once('exit', release);
      return release;
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code !== 'EEXIST') throw e;
      const owner = Number.parseInt(fs.readFileSync(lockPath, 'utf8').trim(), 10);
      const ours = owner === process.pid && held.has(lockPath);
      if (ours || (Number.isFinite(owner) && owner !== process.pid && alive(owner))) {
        throw new DataDirLockedError(path.resolve(dir), owner);
      }
      // A stale lock from a process that died: take it over.
      fs.rmSync(lockPath, { force: true });
    }
  }
  throw new Error(`Could not take the lock ${lockPath}`);
}
