import { afterAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { hitRateLimit } from "@/db/rate-limit";

// A small budget for this file only (env is parsed once per module graph).
process.env.API_RATE_LIMIT_PER_MIN = "5";
const { GET: getMe } = await import("@/app/api/v1/me/route");

afterAll(closeDb);

describe("API rate limits (state in PostgreSQL)", () => {
  it("counts per key within one window", async () => {
    const key = `test:${Date.now()}`;
    const first = await hitRateLimit(getDb(), { key });
    const second = await hitRateLimit(getDb(), { key });
    expect(first.count).toBe(1);
    expect(second.count).toBe(2);
    expect(second.retryAfterSec).toBeGreaterThanOrEqual(1);
    expect(second.retryAfterSec).toBeLessThanOrEqual(60);
  });

  it("answers 429 with Retry-After once a token spends its budget, per token", async () => {
    const token = await tokenFor("viewer@tarnwell.example");
    const statuses: number[] = [];
    let last: Response | undefined;
    for (let i = 0; i < 6; i++) {
      last = await callRoute(getMe, { url: "/api/v1/me", token });
      statuses.push(last.status);
    }
    // A window may roll over mid-test: then the counter restarts; allow for that once.
    if (!statuses.includes(429)) {
      for (let i = 0; i < 6; i++) statuses.push((last = await callRoute(getMe, { url: "/api/v1/me", token })).status);
    }
    expect(statuses.slice(0, 5).every((s) => s === 200) || statuses.includes(429)).toBe(true);
    expect(statuses).toContain(429);
    const limited = last!;
    expect(limited.status).toBe(429);
    expect(Number(limited.headers.get("retry-after"))).toBeGreaterThanOrEqual(1);
    const body = (await limited.json()) as { error: { code: string } };
    expect(body.error.code).toBe("rate_limited");
    // Another token of the same person has its own budget.
    const other = await tokenFor("viewer@tarnwell.example");
    expect((await callRoute(getMe, { url: "/api/v1/me", token: other })).status).toBe(200);
  });
});
