/**
 * The in-process cache of computed values: least recently used entries go first, callers of one
 * key share one computation, failures and values marked not to keep are not kept. Common
 * practice, no published source.
 */
import { describe, expect, it } from 'vitest';
import { DataCache } from '@/lib/db/data-cache';

/** A computation that counts its runs and answers `value`. */
function counted<V>(value: V) {
  const f = Object.assign(async () => { f.runs += 1; return value; }, { runs: 0 });
  return f;
}

describe('DataCache', () => {
  it('computes a key once and answers it from memory after that', async () => {
    const cache = new DataCache<string>({ maxEntries: 4 });
    const compute = counted('figures');
    expect(await cache.get('style-1|v1', compute)).toBe('figures');
    expect(await cache.get('style-1|v1', compute)).toBe('figures');
    expect(compute.runs).toBe(1);
    // Another version of the data is another key.
    expect(await cache.get('style-1|v2', compute)).toBe('figures');
    expect(compute.runs).toBe(2);
  });

  it('callers that ask while the value is being computed share that computation', async () => {
    const cache = new DataCache<number>({ maxEntries: 4 });
    let release!: (n: number) => void;
    let runs = 0;
    const compute = () => { runs += 1; return new Promise<number>((r) => { release = r; }); };
    const answers = Promise.all([cache.get('k', compute), cache.get('k', compute), cache.get('k', compute)]);
    release(42);
    expect(await answers).toEqual([42, 42, 42]);
    expect(runs).toBe(1);
  });

  it('keeps no failure: the next caller computes again', async () => {
    const cache = new DataCache<string>({ maxEntries: 4 });
    await expect(cache.get('k', async () => { throw new Error('database away'); })).rejects.toThrow('database away');
    expect(cache.size).toBe(0);
    expect(await cache.get('k', async () => 'back')).toBe('back');
  });

  it('drops the least recently used entry first', async () => {
    const cache = new DataCache<string>({ maxEntries: 2 });
    await cache.get('a', async () => 'A');
    await cache.get('b', async () => 'B');
    await cache.get('a', async () => 'A again'); // a is now the most recent
    await cache.get('c', async () => 'C');
    expect(cache.size).toBe(2);
    expect(await cache.get('a', async () => 'A recomputed')).toBe('A');
    expect(await cache.get('b', async () => 'B recomputed')).toBe('B recomputed');
  });

  it('stays within its bytes, and does not keep a value larger than all of them', async () => {
    const cache = new DataCache<Uint8Array>({ maxEntries: 100, maxBytes: 1000, sizeOf: (b) => b.byteLength });
    await cache.get('a', async () => new Uint8Array(400));
    await cache.get('b', async () => new Uint8Array(400));
    await cache.get('c', async () => new Uint8Array(400));
    expect(cache.size).toBe(2);
    const huge = counted(new Uint8Array(5000));
    expect((await cache.get('huge', huge)).byteLength).toBe(5000);
    await cache.get('huge', huge);
    expect(huge.runs).toBe(2);
    expect(cache.size).toBe(2);
  });

  it('answers but does not keep a value computed around a part that could not be read', async () => {
    const cache = new DataCache<{ notes: string[] }>({ maxEntries: 4, keepIf: (v) => v.notes.length === 0 });
    const partial = counted({ notes: ['The size spec could not be read just now'] });
    expect((await cache.get('k', partial)).notes).toHaveLength(1);
    await cache.get('k', partial);
    expect(partial.runs).toBe(2);
  });
});
