import path from 'node:path';

/**
 * Import a module of the app that a given build may not have yet (a route's data layer), or
 * null. The path is relative to the repository root; its shape is the caller's to declare.
 */
export async function optional<T>(fromRoot: string): Promise<T | null> {
  const spec = path.resolve(__dirname, '..', fromRoot);
  try {
    return (await import(spec)) as T;
  } catch (e) {
    const code = (e as NodeJS.ErrnoException).code;
    if (code === 'MODULE_NOT_FOUND' || code === 'ERR_MODULE_NOT_FOUND') {
      if (String((e as Error).message).includes(path.basename(fromRoot))) return null;
    }
    throw e;
  }
}
