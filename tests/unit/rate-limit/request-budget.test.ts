import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { RequestBudget, batchSizeFor, type CountIncrement, type CountStore } from "@/lib/rate-limit/request-budget";

/** The shared table every instance writes to (PostgreSQL's rate_limits in the app). */
class SharedCounts {
  readonly totals = new Map<string, number>();
  writes = 0;
  apply(increments: CountIncrement[]): CountIncrement[] {
    this.writes++;
    return increments.map((i) => {
      const id = `${i.key}@${i.windowStartMs}`;
      const count = (this.totals.get(id) ?? 0) + i.count;
      this.totals.set(id, count);
      return { ...i, count };
    });
  }
}

const directStore = (shared: SharedCounts): CountStore => ({ add: (inc) => Promise.resolve(shared.apply(inc)) });

describe("request budget in one instance", () => {
  // Fixed-window counting (common practice for API rate limits): a window admits `limit`
  // requests, the next one starts from zero.
  it("admits exactly the limit in a window, refuses the rest with the seconds left, and starts again in the next window", async () => {
    const shared = new SharedCounts();
    let nowMs = 1_000_000 * 60_000 + 15_000; // 15 s into a window
    const budget = new RequestBudget({ limitPerWindow: 5, windowMs: 60_000, store: directStore(shared), now: () => nowMs });
    const decisions = [];
    for (let i = 0; i < 8; i++) decisions.push(await budget.take("user:a"));
    expect(decisions.map((d) => d.allowed)).toEqual([true, true, true, true, true, false, false, false]);
    expect(decisions[5]!.retryAfterSec).toBe(45);
    // Another person's budget is their own.
    expect((await budget.take("user:b")).allowed).toBe(true);
    nowMs += 45_000;
    expect((await budget.take("user:a")).allowed).toBe(true);
  });

  it("writes in batches: far fewer store writes than requests below the limit", async () => {
    const shared = new SharedCounts();
    const budget = new RequestBudget({ limitPerWindow: 100_000, windowMs: 60_000, store: directStore(shared), now: () => 0 });
    expect(budget.batchSize).toBe(50);
    for (let i = 0; i < 1000; i++) expect((await budget.take("user:a")).allowed).toBe(true);
    await budget.flush();
    expect(shared.totals.get("user:a@0")).toBe(1000);
    // One write per batch of 50.
    expect(shared.writes).toBe(20);
  });

  it("keeps counts that could not be sent and sends them with the next flush", async () => {
    const shared = new SharedCounts();
    let failing = true;
    const store: CountStore = { add: (inc) => (failing ? Promise.reject(new Error("database down")) : Promise.resolve(shared.apply(inc))) };
    const budget = new RequestBudget({ limitPerWindow: 100_000, windowMs: 60_000, store, now: () => 0 });
    for (let i = 0; i < 10; i++) await budget.take("user:a");
    await expect(budget.flush()).rejects.toThrow("database down");
    failing = false;
    await budget.flush();
    expect(shared.totals.get("user:a@0")).toBe(10);
  });

  it("sizes batches at about 1 % of the limit, between 1 and 50", () => {
    expect([1, 5, 99, 100, 600, 4_999, 5_000, 1_000_000].map(batchSizeFor)).toEqual([1, 1, 1, 1, 6, 49, 50, 50]);
  });
});

describe("request budget shared by several instances", () => {
  // Stated tolerance: a window admits at most limit + instances × (batchSize − 1); and
  // nobody is refused before the limit is reached.
  it("admits no more than the limit plus the stated tolerance, and refuses nobody below the limit, whatever the interleaving", async () => {
    let largestRun = 0;
    await fc.assert(
      fc.asyncProperty(
        fc.scheduler(),
        fc.integer({ min: 2, max: 4 }),
        fc.integer({ min: 50, max: 1500 }),
        // Each request: which instance takes it, and how many store answers arrive before it.
        fc.array(fc.tuple(fc.nat(), fc.integer({ min: 0, max: 2 })), { minLength: 50, maxLength: 2000, size: "max" }),
        fc.array(fc.nat(), { maxLength: 40 }),
        async (s, instances, limit, requests, flushPoints) => {
          const shared = new SharedCounts();
          const budgets = Array.from(
            { length: instances },
            () => new RequestBudget({ limitPerWindow: limit, windowMs: 60_000, now: () => 0, store: { add: s.scheduleFunction(async (inc: CountIncrement[]) => shared.apply(inc)) } }),
          );
          const flushAt = new Set(flushPoints.map((p) => p % requests.length));
          const all: Promise<boolean>[] = [];
          const flushes: Promise<void>[] = [];
          for (const [i, [n, answersBefore]] of requests.entries()) {
            for (let k = 0; k < answersBefore && s.count() > 0; k++) await s.waitOne();
            const budget = budgets[n % instances]!;
            all.push(budget.take("user:a").then((d) => d.allowed));
            if (flushAt.has(i)) flushes.push(budget.flush());
          }
          while (s.count() > 0) await s.waitOne();
          const decisions = await Promise.all(all);
          await Promise.all(flushes);
          const admitted = decisions.filter(Boolean).length;
          largestRun = Math.max(largestRun, decisions.length);
          const batch = batchSizeFor(limit);
          expect(admitted).toBeLessThanOrEqual(limit + instances * (batch - 1));
          if (decisions.includes(false)) expect(admitted).toBeGreaterThanOrEqual(limit);
          else expect(admitted).toBe(decisions.length);
        },
      ),
      { numRuns: 25 },
    );
    // The runs reached realistic sizes: over a thousand requests in one window.
    expect(largestRun).toBeGreaterThan(1000);
  }, 120_000);
});
