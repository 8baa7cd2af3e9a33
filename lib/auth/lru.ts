/**
 * A bounded map that forgets the entry used longest ago once it holds `capacity` entries.
 * A JavaScript Map keeps insertion order, so a hit is moved to the end by deleting and setting it
 * again, and the first key is always the one used longest ago. Common practice, no published source.
 */
export class LruMap<K, V> {
  private readonly entries = new Map<K, V>();

  constructor(readonly capacity: number) {
    if (!Number.isInteger(capacity) || capacity < 1) throw new RangeError('capacity must be a whole number of at least 1');
  }

  get size(): number {
    return this.entries.size;
  }

  /** The value for `key`, marking it as used just now; undefined when absent. */
  get(key: K): V | undefined {
    if (!this.entries.has(key)) return undefined;
    const value = this.entries.get(key) as V;
    this.entries.delete(key);
    this.entries.set(key, value);
    return value;
  }

  /** Stores `value` as used just now, forgetting the entry used longest ago when full. */
  set(key: K, value: V): void {
    if (this.entries.has(key)) this.entries.delete(key);
    else if (this.entries.size >= this.capacity) {
      const oldest = this.entries.keys().next();
      if (!oldest.done) this.entries.delete(oldest.value);
    }
    this.entries.set(key, value);
  }

  delete(key: K): boolean {
    return this.entries.delete(key);
  }

  clear(): void {
    this.entries.clear();
  }
}
