import { describe, expect, it } from 'vitest';
import { cachedRead, invalidateReads } from '@/lib/data/read-cache';

describe('read cache', () => {
  it('serves a second read from the cache, per database', async () => {
    const dbA = {};
    const dbB = {};
    let loads = 0;
    const load = async () => ++loads;
    expect(await cachedRead(dbA, 'species', 'x', load)).toBe(1);
    expect(await cachedRead(dbA, 'species', 'x', load)).toBe(1);
    expect(await cachedRead(dbB, 'species', 'x', load)).toBe(2);
  });

  it('drops entries when the namespace is written, and after the TTL', async () => {
    const db = {};
    let loads = 0;
    const load = async () => ++loads;
    await cachedRead(db, 'settings', 'club', load);
    invalidateReads('settings');
    expect(await cachedRead(db, 'settings', 'club', load)).toBe(2);
    // An entry stored with a TTL of 0 is stale at once.
    expect(await cachedRead(db, 'settings', 'other', load, 0)).toBe(3);
    await new Promise((r) => setTimeout(r, 2));
    expect(await cachedRead(db, 'settings', 'other', load, 0)).toBe(4);
  });

  it('does not keep a failed load', async () => {
    const db = {};
    await expect(cachedRead(db, 'species', 'bad', () => Promise.reject(new Error('down')))).rejects.toThrow('down');
    expect(await cachedRead(db, 'species', 'bad', async () => 'up')).toBe('up');
  });
});
