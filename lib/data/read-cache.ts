import 'server-only';

// A short-lived cache for hot, rarely-changing reads (published wizard species, club settings,
// the temperature records a tree's plan reads).
// Entries are kept per database handle, so tests that open several in-memory databases never
// see each other's rows. Writers bump the namespace's generation, which drops its entries at once:
// in this process directly, in the others on one PostgreSQL through their invalidation listeners
// (lib/data/invalidation.ts). The TTL bounds staleness should a notification be missed.

export type ReadNamespace = 'species' | 'settings' | 'temperatures';
type Entry = { value: Promise<unknown>; expires: number; generation: number };
const g = globalThis as unknown as {
  __cwReadCache?: WeakMap<object, Map<string, Entry>>;
  __cwReadGenerations?: Record<ReadNamespace, number>;
};
const byDb = (g.__cwReadCache ??= new WeakMap());
const generations = (g.__cwReadGenerations ??= { species: 0, settings: 0, temperatures: 0 });
// A process that kept the older two-namespace object across a hot reload gets the third.
generations.temperatures ??= 0;

const READ_CACHE_TTL_MS = 5_000;

export function cachedRead<T>(db: object, ns: ReadNamespace, key: string, load: () => Promise<T>, ttlMs = READ_CACHE_TTL_MS): Promise<T> {
  let entries = byDb.get(db);
  if (!entries) byDb.set(db, (entries = new Map()));
  const id = `${ns}:${key}`;
  const now = Date.now();
  const hit = entries.get(id);
  if (hit && hit.expires > now && hit.generation === generations[ns]) return hit.value as Promise<T>;
  const value = load();
  const map = entries;
  map.set(id, { value, expires: now + ttlMs, generation: generations[ns] });
  // A failed load is not kept.
  value.catch(() => {
    if (map.get(id)?.value === value) map.delete(id);
  });
  return value;
}

/** After a write: every cached read of the namespace is stale, in every database of this process. */
export function invalidateReads(ns: ReadNamespace) {
  generations[ns] += 1;
}
