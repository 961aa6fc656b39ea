import { describe, expect, it } from "vitest";
import { ExpiringMemo } from "@/lib/cache/expiring-memo";

/** A load whose answer the test releases when it wants, recording which keys each call asked for. */
function controlledLoader() {
  const calls: string[][] = [];
  const pending: { resolve: (m: Map<string, string>) => void; reject: (e: Error) => void; keys: string[] }[] = [];
  const load = (keys: string[]) =>
    new Promise<Map<string, string>>((resolve, reject) => {
      calls.push([...keys]);
      pending.push({ resolve, reject, keys });
    });
  /** Answers the oldest open call with `value@key` for each key it asked for (except `unknown`). */
  const answer = (tag: string, unknown: string[] = []) => {
    const p = pending.shift()!;
    p.resolve(new Map(p.keys.filter((k) => !unknown.includes(k)).map((k) => [k, `${tag}@${k}`])));
  };
  const fail = (message: string) => pending.shift()!.reject(new Error(message));
  return { calls, load, answer, fail };
}

const tick = () => new Promise((r) => setTimeout(r, 0));

describe("expiring memo", () => {
  it("answers from memory until the entry's time is up, counted from when its load began", async () => {
    let nowMs = 1_000;
    const memo = new ExpiringMemo<string>({ ttlMs: 5_000, maxEntries: 10, now: () => nowMs });
    const l = controlledLoader();
    const first = memo.getMany(["a"], l.load);
    nowMs = 2_000; // the load takes a second
    l.answer("v1");
    expect(await first).toEqual(new Map([["a", "v1@a"]]));
    nowMs = 5_999;
    expect(await memo.getMany(["a"], l.load)).toEqual(new Map([["a", "v1@a"]]));
    expect(l.calls).toEqual([["a"]]);
    nowMs = 6_000; // 5 s after the load began, though only 4 s after it answered
    const again = memo.getMany(["a"], l.load);
    await tick();
    expect(l.calls).toEqual([["a"], ["a"]]);
    l.answer("v2");
    expect(await again).toEqual(new Map([["a", "v2@a"]]));
  });

  it("loads only the missing keys, all in one call, and concurrent misses share that call", async () => {
    const memo = new ExpiringMemo<string>({ ttlMs: 60_000, maxEntries: 10, now: () => 0 });
    const l = controlledLoader();
    const warm = memo.getMany(["a"], l.load);
    l.answer("v");
    await warm;
    const requests = Array.from({ length: 50 }, () => memo.getMany(["a", "b", "c", "b"], l.load));
    await tick();
    expect(l.calls).toEqual([["a"], ["b", "c"]]);
    l.answer("v");
    for (const r of await Promise.all(requests)) expect(r).toEqual(new Map([["a", "v@a"], ["b", "v@b"], ["c", "v@c"]]));
  });

  it("a key the load does not answer is left out and asked again next time", async () => {
    const memo = new ExpiringMemo<string>({ ttlMs: 60_000, maxEntries: 10, now: () => 0 });
    const l = controlledLoader();
    const r = memo.getMany(["a", "gone"], l.load);
    l.answer("v", ["gone"]);
    expect(await r).toEqual(new Map([["a", "v@a"]]));
    const again = memo.getMany(["a", "gone"], l.load);
    await tick();
    expect(l.calls).toEqual([["a", "gone"], ["gone"]]);
    l.answer("v", ["gone"]);
    await again;
  });

  it("a load running when the memory is cleared is neither kept nor joined by later requests", async () => {
    const memo = new ExpiringMemo<string>({ ttlMs: 60_000, maxEntries: 10, now: () => 0 });
    const l = controlledLoader();
    const before = memo.getMany(["a"], l.load); // reads what was there before a change
    await tick();
    memo.clear(); // the change has committed
    const after = memo.getMany(["a"], l.load); // must not share the load from before
    await tick();
    expect(l.calls).toEqual([["a"], ["a"]]);
    l.answer("old");
    l.answer("new");
    expect(await before).toEqual(new Map([["a", "old@a"]]));
    expect(await after).toEqual(new Map([["a", "new@a"]]));
    // What is remembered is the load that began after the clear.
    expect(await memo.getMany(["a"], l.load)).toEqual(new Map([["a", "new@a"]]));
    expect(l.calls.length).toBe(2);
  });

  it("a failed load fails every request waiting on it, and is not remembered", async () => {
    const memo = new ExpiringMemo<string>({ ttlMs: 60_000, maxEntries: 10, now: () => 0 });
    const l = controlledLoader();
    const one = memo.getMany(["a"], l.load);
    const two = memo.getMany(["a"], l.load);
    await tick();
    l.fail("database unavailable");
    await expect(one).rejects.toThrow("database unavailable");
    await expect(two).rejects.toThrow("database unavailable");
    const three = memo.getMany(["a"], l.load);
    await tick();
    expect(l.calls).toEqual([["a"], ["a"]]);
    l.answer("v");
    expect(await three).toEqual(new Map([["a", "v@a"]]));
  });

  it("holds at most maxEntries, dropping the oldest first", async () => {
    const memo = new ExpiringMemo<string>({ ttlMs: 60_000, maxEntries: 3, now: () => 0 });
    const l = controlledLoader();
    for (const key of ["a", "b", "c", "d"]) {
      const r = memo.getMany([key], l.load);
      l.answer("v");
      await r;
    }
    expect(memo.size).toBe(3);
    const again = memo.getMany(["a", "d"], l.load);
    await tick();
    expect(l.calls.at(-1)).toEqual(["a"]);
    l.answer("v");
    await again;
  });
});
