import { execFileSync } from "node:child_process";
import fs from "node:fs";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { GET as health } from "@/app/api/health/route";
import { GET as live } from "@/app/api/health/live/route";
import { GET as getMe } from "@/app/api/v1/me/route";
import { NextRequest } from "next/server";
import { proxy } from "@/proxy";

const localCluster = process.env.LOOPKEEPER_LOCAL_CLUSTER === "1";

function pg(cmd: "up" | "down") {
  // Without DATABASE_URL the script manages the private cluster instead of deferring to that URL.
  const { DATABASE_URL: _url, ...env } = process.env;
  execFileSync("node", ["scripts/pg.mjs", cmd, ...(cmd === "up" ? ["loopkeeper_test"] : [])], { stdio: "pipe", env });
}

async function timed<T>(fn: () => Promise<T>): Promise<{ value: T; ms: number }> {
  const t0 = performance.now();
  const value = await fn();
  return { value, ms: performance.now() - t0 };
}

afterAll(async () => {
  if (localCluster) pg("up");
  await closeDb();
});

describe.runIf(localCluster)("PostgreSQL stopped while the app runs", () => {
  it("answers 503 quickly with a clear message, and recovers by itself", async () => {
    const token = await tokenFor("viewer@tarnwell.example");
    expect((await callRoute(health, { url: "/api/health" })).status).toBe(200);

    pg("down");
    const down = await timed(() => callRoute(health, { url: "/api/health" }));
    expect(down.value.status).toBe(503);
    expect(await down.value.json()).toMatchObject({ database: "down" });
    expect(down.ms).toBeLessThan(5000);
    // Liveness does no I/O: the process is fine, so a load balancer must not restart it.
    const alive = live();
    expect(alive.status).toBe(200);
    expect(await alive.json()).toEqual({ status: "ok" });

    const api = await timed(() => callRoute(getMe, { url: "/api/v1/me", token }));
    expect(api.value.status).toBe(503);
    const body = (await api.value.json()) as { error: { code: string; message: string } };
    expect(body.error.code).toBe("unavailable");
    expect(body.error.message).toMatch(/database is not reachable/i);
    expect(JSON.stringify(body)).not.toMatch(/ECONNREFUSED|at .*\.ts|stack/);
    expect(api.value.headers.get("retry-after")).toBe("5");
    expect(api.ms).toBeLessThan(5000);

    // Screens answer 503 too, with a page that says what is going on.
    const page = await timed(() => proxy(new NextRequest("http://127.0.0.1:3000/profiles")));
    expect(page.value.status).toBe(503);
    expect(await page.value.text()).toMatch(/cannot reach its database/);
    expect(page.ms).toBeLessThan(5000);

    pg("up");
    const upAt = performance.now();
    let status = 0;
    for (let i = 0; i < 30 && status !== 200; i++) {
      status = (await callRoute(health, { url: "/api/health" })).status;
      if (status !== 200) await new Promise((r) => setTimeout(r, 500));
    }
    expect(status).toBe(200);
    const recoveredMs = performance.now() - upAt;
    fs.mkdirSync(".data", { recursive: true });
    fs.writeFileSync(".data/outage-stats.json", JSON.stringify({ healthDownMs: Math.round(down.ms), apiDownMs: Math.round(api.ms), pageDownMs: Math.round(page.ms), recoveredAfterRestartMs: Math.round(recoveredMs) }, null, 2));
    expect((await callRoute(getMe, { url: "/api/v1/me", token })).status).toBe(200);
    // Signed-out visitors of a screen go to sign-in again once the database is back.
    expect((await proxy(new NextRequest("http://127.0.0.1:3000/profiles"))).status).toBe(307);
  });
});
