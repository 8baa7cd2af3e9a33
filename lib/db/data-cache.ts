/**
 * A bounded in-process cache of values computed from the database, keyed by the versions of the
 * data they were computed from (see `findStyleStamped` in ./styles).
 *
 * Each app server process keeps a cache of its own; nothing is shared between processes and
 * nothing needs to be invalidated: a write raises a version, so the next request asks for another
 * key and the old entry ages out. That is what makes it safe behind a load balancer — every
 * process answers from the current data or computes it — and why restarting a process only costs
 * the first requests their computation.
 */

export interface DataCacheOptions<V> {
  /** Most entries kept. */
  maxEntries: number;
  /** Most bytes kept, by `sizeOf`; an entry larger than this is computed but not kept. */
  maxBytes?: number;
  /** Approximate bytes an entry holds (default 0: bounded by `maxEntries` only). */
  sizeOf?: (value: V) => number;
  /** False for a value that is returned but not kept (e.g. one computed around a part that could not be read). */
  keepIf?: (value: V) => boolean;
}

/**
 * Least recently used entries are dropped first. `get` computes a missing entry once: callers that
 * ask for the same key while it is being computed share that computation. A computation that fails
 * is not kept (the next call tries again).
 */
export class DataCache<V> {
  private readonly entries = new Map<string, { value: V; bytes: number }>();
  private readonly pending = new Map<string, Promise<V>>();
  private bytes = 0;

  constructor(private readonly options: DataCacheOptions<V>) {}

  /** The value for `key`, computed by `compute` when it is not kept. */
  async get(key: string, compute: () => Promise<V>): Promise<V> {
    const hit = this.entries.get(key);
    if (hit) {
      // Re-inserting moves the key to the end: Map keeps insertion order, the first key is the oldest.
      this.entries.delete(key);
      this.entries.set(key, hit);
      return hit.value;
    }
    const running = this.pending.get(key);
    if (running) return running;
    const started = compute().then(
      (value) => {
        this.pending.delete(key);
        this.keep(key, value);
        return value;
      },
      (err: unknown) => {
        this.pending.delete(key);
        throw err;
      },
    );
    this.pending.set(key, started);
    return started;
  }

  /** Entries kept now (for tests and figures). */
  get size(): number {
    return this.entries.size;
  }

  /** Drops every entry (tests). */
  clear(): void {
    this.entries.clear();
    this.bytes = 0;
  }

  private keep(key: string, value: V): void {
    if (this.options.keepIf && !this.options.keepIf(value)) return;
    const bytes = this.options.sizeOf?.(value) ?? 0;
    const maxBytes = this.options.maxBytes ?? Infinity;
    if (bytes > maxBytes) return;
    const old = this.entries.get(key);
    if (old) {
      this.entries.delete(key);
      this.bytes -= old.bytes;
    }
    this.entries.set(key, { value, bytes });
    this.bytes += bytes;
    for (const [k, e] of this.entries) {
      if (this.entries.size <= this.options.maxEntries && this.bytes <= maxBytes) break;
      this.entries.delete(k);
      this.bytes -= e.bytes;
    }
  }
}
