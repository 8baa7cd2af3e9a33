import { describe, expect, it } from 'vitest';
import { LruMap } from '@/lib/auth/lru';

// Common practice, no published source: a bounded cache that forgets what was used longest ago.
describe('LruMap', () => {
  it('never holds more than its capacity and forgets the entry used longest ago', () => {
    const m = new LruMap<string, number>(3);
    m.set('a', 1);
    m.set('b', 2);
    m.set('c', 3);
    m.set('d', 4);
    expect(m.size).toBe(3);
    expect(m.get('a')).toBeUndefined();
    expect([m.get('b'), m.get('c'), m.get('d')]).toEqual([2, 3, 4]);
  });

  it('a read counts as a use: the entry read survives the next eviction', () => {
    const m = new LruMap<string, number>(2);
    m.set('a', 1);
    m.set('b', 2);
    expect(m.get('a')).toBe(1);
    m.set('c', 3);
    expect(m.get('b')).toBeUndefined();
    expect(m.get('a')).toBe(1);
    expect(m.get('c')).toBe(3);
  });

  it('setting a key again replaces its value without evicting another', () => {
    const m = new LruMap<string, number>(2);
    m.set('a', 1);
    m.set('b', 2);
    m.set('a', 10);
    expect(m.size).toBe(2);
    expect(m.get('a')).toBe(10);
    expect(m.get('b')).toBe(2);
  });

  it('keeps falsy values apart from absent ones, deletes and clears', () => {
    const m = new LruMap<string, number | null>(2);
    m.set('zero', 0);
    m.set('none', null);
    expect(m.get('zero')).toBe(0);
    expect(m.get('none')).toBeNull();
    expect(m.delete('zero')).toBe(true);
    expect(m.get('zero')).toBeUndefined();
    m.clear();
    expect(m.size).toBe(0);
  });

  it('refuses a capacity below one', () => {
    expect(() => new LruMap(0)).toThrow(RangeError);
    expect(() => new LruMap(1.5)).toThrow(RangeError);
  });
});
