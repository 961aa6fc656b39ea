import { afterAll, describe, expect, it } from "vitest";
import { closeDb, demoActor, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { addRateLimitCounts } from "@/db/rate-limit";
import { createUser } from "@/lib/use-cases/admin/users";

// A small budget for this file only (env is parsed once per module graph). Below 100 a
// minute every request is counted in PostgreSQL at once, so the limit is exact here.
process.env.API_RATE_LIMIT_PER_MIN = "5";
const { GET: getMe } = await import("@/app/api/v1/me/route");

afterAll(closeDb);

describe("API rate limits (counts shared in PostgreSQL)", () => {
  it("adds a batch of counts in one statement and returns each window's total", async () => {
    const stamp = Date.now();
    const windowStartMs = Math.floor(stamp / 60_000) * 60_000;
    const a = `test:a:${stamp}`;
    const b = `test:b:${stamp}`;
    const first = await addRateLimitCounts(getDb(), [
      { key: a, windowStartMs, count: 3 },
      { key: b, windowStartMs, count: 1 },
    ]);
    expect(first.sort((x, y) => x.key.localeCompare(y.key))).toEqual([
      { key: a, windowStartMs, count: 3 },
      { key: b, windowStartMs, count: 1 },
    ]);
    // Another instance's batch adds to the same totals.
    expect(await addRateLimitCounts(getDb(), [{ key: a, windowStartMs, count: 4 }])).toEqual([{ key: a, windowStartMs, count: 7 }]);
    // The next window is a row of its own.
    expect(await addRateLimitCounts(getDb(), [{ key: a, windowStartMs: windowStartMs + 60_000, count: 1 }])).toEqual([{ key: a, windowStartMs: windowStartMs + 60_000, count: 1 }]);
  });

  it("gives a person one budget across all their tokens: 429 with Retry-After once it is spent, others unaffected", async () => {
    const tokens = [await tokenFor("viewer@tarnwell.example"), await tokenFor("viewer@tarnwell.example")];
    const statuses: number[] = [];
    let last: Response | undefined;
    const round = async () => {
      for (let i = 0; i < 6; i++) {
        last = await callRoute(getMe, { url: "/api/v1/me", token: tokens[i % 2] });
        statuses.push(last.status);
      }
    };
    await round();
    // A window may roll over mid-test: then the counter restarts; allow for that once.
    if (!statuses.includes(429)) await round();
    expect(statuses).toContain(429);
    // Spread over two tokens, five requests used the budget: the sixth was refused.
    expect(statuses.indexOf(429)).toBeLessThanOrEqual(5);
    const limited = last!;
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);
    const body = (await limited.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("rate_limited");
    expect(body.error.message).toMatch(/across all its sessions and API tokens/);
    // A third, new token of the same person gets no fresh budget…
    const third = await tokenFor("viewer@tarnwell.example");
    expect((await callRoute(getMe, { url: "/api/v1/me", token: third })).status).toBe(429);
    // …while another person's budget is their own. A person made for this check: the demo
    // accounts are used by other test files within the same minute, and counts are shared.
    const email = `budget-${Date.now()}@tarnwell.example`;
    await createUser(getDb(), await demoActor("admin@tarnwell.example"), { email, name: "Budget check", role: "viewer", passwordHash: "not-a-password-hash" });
    expect((await callRoute(getMe, { url: "/api/v1/me", token: await tokenFor(email) })).status).toBe(200);
  });
});
