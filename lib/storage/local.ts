import fs from 'node:fs/promises';
import path from 'node:path';
import { randomBytes } from 'node:crypto';
import { isStorageKey, type Storage } from './types';

/** Objects as files below one root directory. */
export class LocalDirStorage implements Storage {
  readonly root: string;

  constructor(root: string) {
    this.root = path.resolve(root);
  }

  /** The file for a key; refuses anything that is not a key this module generated. */
  private fileOf(key: string): string {
    if (!isStorageKey(key)) throw new Error(`Refusing a storage key the server did not generate: ${JSON.stringify(key)}`);
    const file = path.resolve(this.root, key);
    if (!file.startsWith(this.root + path.sep)) throw new Error('Storage key escapes the root directory.');
    return file;
  }

  async put(key: string, data: Buffer): Promise<void> {
    const file = this.fileOf(key);
    await fs.mkdir(path.dirname(file), { recursive: true });
    // Write beside the target, then rename: a crash never leaves a partial file under the key.
    const tmp = `${file}.${randomBytes(6).toString('hex')}.tmp`;
    try {
      await fs.writeFile(tmp, data, { flag: 'wx', mode: 0o640 });
      await fs.rename(tmp, file);
    } catch (e) {
      await fs.rm(tmp, { force: true });
      throw e;
    }
  }

  async get(key: string): Promise<Buffer | null> {
    try {
      return await fs.readFile(this.fileOf(key));
    } catch (e) {
      if ((e as NodeJS.ErrnoException).code === 'ENOENT') return null;
      throw e;
    }
  }

  async delete(key: string): Promise<void> {
    await fs.rm(this.fileOf(key), { force: true });
  }
}
