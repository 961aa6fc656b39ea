/**
 * Values loaded by key and kept in this process for a fixed time, with what a plain Map
 * lacks for a hot path: concurrent misses of one key share one load (no stampede when an
 * entry expires under load), and a load that began before `clear()` never stores its value
 * after it, nor is it joined by a request that comes after it — so a caller that clears
 * right after committing a change never gets the value from before the change back.
 */
export class ExpiringMemo<V> {
  private readonly entries = new Map<string, { value: V; expiresAtMs: number }>();
  private readonly loading = new Map<string, Promise<V | undefined>>();
  private generation = 0;

  constructor(private readonly options: { ttlMs: number; maxEntries: number; now?: () => number }) {}

  private now(): number {
    return this.options.now?.() ?? Date.now();
  }

  /**
   * The values of `keys`: fresh ones from memory, keys already being loaded from that load,
   * the rest from one call of `load`. A key `load` does not answer is left out of the result
   * and not remembered. When a load fails, every request waiting on it fails with it.
   */
  async getMany(keys: readonly string[], load: (missing: string[]) => Promise<ReadonlyMap<string, V>>): Promise<Map<string, V>> {
    const out = new Map<string, V>();
    const waits: Promise<void>[] = [];
    const missing: string[] = [];
    const now = this.now();
    for (const key of new Set(keys)) {
      const entry = this.entries.get(key);
      if (entry && entry.expiresAtMs > now) {
        out.set(key, entry.value);
        continue;
      }
      if (entry) this.entries.delete(key);
      const pending = this.loading.get(key);
      if (!pending) {
        missing.push(key);
        continue;
      }
      waits.push(
        pending.then((v) => {
          if (v !== undefined) out.set(key, v);
        }),
      );
    }
    if (missing.length) {
      waits.push(
        this.loadMissing(missing, load, now).then((loaded) => {
          for (const key of missing) {
            const v = loaded.get(key);
            if (v !== undefined) out.set(key, v);
          }
        }),
      );
    }
    await Promise.all(waits);
    return out;
  }

  private async loadMissing(missing: string[], load: (missing: string[]) => Promise<ReadonlyMap<string, V>>, startedAtMs: number): Promise<ReadonlyMap<string, V>> {
    const generation = this.generation;
    const batch = load(missing);
    const perKey = missing.map((key) => {
      const p = batch.then((m) => m.get(key));
      // Handled here so a failed load with no other waiter is not an unhandled rejection; waiters still see it.
      p.catch(() => undefined);
      this.loading.set(key, p);
      return [key, p] as const;
    });
    try {
      const loaded = await batch;
      if (generation === this.generation) {
        // Counted from when the load began: the value is at least that fresh, never older.
        const expiresAtMs = startedAtMs + this.options.ttlMs;
        for (const [key, value] of loaded) {
          if (!missing.includes(key)) continue;
          if (this.entries.size >= this.options.maxEntries) this.entries.delete(this.entries.keys().next().value!);
          this.entries.set(key, { value, expiresAtMs });
        }
      }
      return loaded;
    } finally {
      for (const [key, p] of perKey) if (this.loading.get(key) === p) this.loading.delete(key);
    }
  }

  /** Forgets every value, and every load still running (their answers are not kept or shared). */
  clear(): void {
    this.generation++;
    this.entries.clear();
    this.loading.clear();
  }

  get size(): number {
    return this.entries.size;
  }
}
