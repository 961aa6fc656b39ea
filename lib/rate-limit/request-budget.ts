/**
 * A fixed-window request budget per key (one per user), counted in the process and written
 * to a shared store in batches, so most requests cost no database write while several app
 * instances still share one budget.
 *
 * How the limit holds across instances: an instance admits a request on its own only while
 * fewer than `batchSize` of its admissions for that key are not yet confirmed by the store
 * and its own view (last total the store returned + its unconfirmed admissions) is under the
 * limit. Past either, the request is counted in the store first (write-through) and admitted
 * only when the store's total is within the limit. So at any moment each instance holds fewer
 * than `batchSize` admissions the others cannot see, and a window admits at most
 * `limit + instances × (batchSize − 1)` requests. `batchSizeFor` keeps that near 1 % of the
 * limit (1 for small limits: then every request is counted exactly).
 */

export interface CountIncrement {
  key: string;
  windowStartMs: number;
  count: number;
}

/** Where the instances' counts meet (PostgreSQL in the app): adds increments and returns each key's new window total. */
export interface CountStore {
  add(increments: CountIncrement[]): Promise<CountIncrement[]>;
}

export interface BudgetDecision {
  allowed: boolean;
  /** Seconds until this window ends: the Retry-After of a refused request. */
  retryAfterSec: number;
}

interface KeyState {
  windowStartMs: number;
  /** Highest window total the store has returned for this key. */
  confirmed: number;
  /** Admitted here, not yet sent to the store. */
  pending: number;
  /** Admitted here, sent to the store, answer not back yet. */
  inFlight: number;
}

/** About 1 % of the limit, between 1 and 50: the most any one instance admits without the store's say. */
export function batchSizeFor(limitPerWindow: number): number {
  return Math.max(1, Math.min(50, Math.floor(limitPerWindow / 100)));
}

export class RequestBudget {
  private readonly states = new Map<string, KeyState>();
  readonly batchSize: number;

  constructor(
    private readonly options: { limitPerWindow: number; windowMs: number; store: CountStore; now?: () => number; batchSize?: number },
  ) {
    this.batchSize = options.batchSize ?? batchSizeFor(options.limitPerWindow);
  }

  private now(): number {
    return this.options.now?.() ?? Date.now();
  }

  private stateFor(key: string, windowStartMs: number): KeyState {
    let s = this.states.get(key);
    // A new window starts from nothing; the old window's unsent counts no longer matter.
    if (!s || s.windowStartMs !== windowStartMs) {
      s = { windowStartMs, confirmed: 0, pending: 0, inFlight: 0 };
      this.states.set(key, s);
    }
    return s;
  }

  private async send(key: string, s: KeyState, count: number): Promise<number> {
    s.inFlight += count;
    try {
      const [total] = await this.options.store.add([{ key, windowStartMs: s.windowStartMs, count }]);
      const n = total?.count ?? 0;
      s.confirmed = Math.max(s.confirmed, n);
      return n;
    } finally {
      s.inFlight -= count;
    }
  }

  /** Counts one request for this key; refused when the key's budget for the current window is spent. */
  async take(key: string): Promise<BudgetDecision> {
    const now = this.now();
    const { windowMs, limitPerWindow: limit } = this.options;
    const windowStartMs = Math.floor(now / windowMs) * windowMs;
    const retryAfterSec = Math.max(1, Math.ceil((windowStartMs + windowMs - now) / 1000));
    const s = this.stateFor(key, windowStartMs);
    if (s.confirmed >= limit) return { allowed: false, retryAfterSec };
    const unconfirmed = s.pending + s.inFlight;
    if (unconfirmed + 1 < this.batchSize && s.confirmed + unconfirmed + 1 <= limit) {
      s.pending++;
      return { allowed: true, retryAfterSec };
    }
    // At the batch size or near the limit: this request and the ones waiting go to the store now.
    const count = s.pending + 1;
    s.pending = 0;
    let total: number;
    try {
      total = await this.send(key, s, count);
    } catch (err) {
      // Keep the admitted ones for the next flush; this request fails with the store.
      if (this.states.get(key) === s) s.pending += count - 1;
      throw err;
    }
    return { allowed: total <= limit, retryAfterSec };
  }

  /** Sends every key's unsent counts in one batch (called on a timer, so other instances see them soon). */
  async flush(): Promise<void> {
    const batch: { key: string; s: KeyState; count: number }[] = [];
    for (const [key, s] of this.states) {
      if (s.pending > 0) {
        batch.push({ key, s, count: s.pending });
        s.inFlight += s.pending;
        s.pending = 0;
      }
    }
    if (!batch.length) return;
    try {
      const totals = await this.options.store.add(batch.map(({ key, s, count }) => ({ key, windowStartMs: s.windowStartMs, count })));
      for (const t of totals) {
        const s = this.states.get(t.key);
        if (s && s.windowStartMs === t.windowStartMs) s.confirmed = Math.max(s.confirmed, t.count);
      }
    } catch (err) {
      for (const { key, s, count } of batch) if (this.states.get(key) === s) s.pending += count;
      throw err;
    } finally {
      for (const { s, count } of batch) s.inFlight -= count;
    }
  }

  /** Forgets keys whose window has passed, so the map does not grow with every user ever seen. */
  sweep(): void {
    const windowStartMs = Math.floor(this.now() / this.options.windowMs) * this.options.windowMs;
    for (const [key, s] of this.states) if (s.windowStartMs < windowStartMs && s.pending === 0 && s.inFlight === 0) this.states.delete(key);
  }
}
