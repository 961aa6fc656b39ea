import { randomBytes } from "node:crypto";
import { afterAll, describe, expect, it } from "vitest";
import { closeDb, demoActor, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { withRequestStats } from "@/db/request-stats";
import { listTokens } from "@/db/tokens";
import { revokeToken } from "@/lib/use-cases/account/tokens";
import { createUser, updateUser } from "@/lib/use-cases/admin/users";
import { actorCaches } from "@/lib/platform/auth/actor-cache";
import { GET as getMe } from "@/app/api/v1/me/route";

afterAll(closeDb);

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** The cache only stores once its LISTEN connection is up; wait for that (bounded). */
async function cacheListening(): Promise<void> {
  for (let i = 0; i < 200 && !actorCaches().tokens.listening; i++) await sleep(25);
  expect(actorCaches().tokens.listening).toBe(true);
}

/**
 * Repeats a call until its status is `want` or 100 tries 20 ms apart have passed: the change
 * notice travels asynchronously. The cache keeps entries 10 s, far longer than these tries,
 * so reaching `want` shows the notice cleared the entry, not its expiry.
 */
async function eventually(call: () => Promise<Response>, want: number): Promise<Response> {
  let res = await call();
  for (let i = 0; i < 100 && res.status !== want; i++) {
    await sleep(20);
    res = await call();
  }
  return res;
}

async function freshUser(role: "viewer" | "support") {
  const admin = await demoActor("admin@tarnwell.example");
  const email = `cache-${randomBytes(4).toString("hex")}@tarnwell.example`;
  const user = await createUser(getDb(), admin, { email, name: "Cache Test", role, passwordHash: "x" });
  return { admin, user, token: await tokenFor(email) };
}

describe("token → actor cache", () => {
  it("answers repeated calls of a token from memory, without a query for the caller", async () => {
    await cacheListening();
    const { token } = await freshUser("viewer");
    const cold = await withRequestStats(() => callRoute(getMe, { url: "/api/v1/me", token }));
    expect(cold.result.status).toBe(200);
    // The token lookup, and the first-use stamp (kept to the minute).
    expect(cold.stats.actorQueries).toBe(2);
    const warm = await withRequestStats(() => callRoute(getMe, { url: "/api/v1/me", token }));
    expect(warm.result.status).toBe(200);
    expect(warm.stats).toEqual({ queries: 0, sessionLookups: 0, actorQueries: 0 });
  });

  it("drops a revoked token at once", async () => {
    await cacheListening();
    const { user, token } = await freshUser("viewer");
    expect((await callRoute(getMe, { url: "/api/v1/me", token })).status).toBe(200);
    const [stored] = await listTokens(getDb(), { userId: user.id });
    await revokeToken(getDb(), { userId: user.id, label: user.email }, { id: stored!.id, userId: user.id });
    expect((await eventually(() => callRoute(getMe, { url: "/api/v1/me", token }), 401)).status).toBe(401);
  });

  it("sees a role change and a disabled user at once", async () => {
    await cacheListening();
    const { admin, user, token } = await freshUser("viewer");
    expect(await (await callRoute(getMe, { url: "/api/v1/me", token })).json()).toMatchObject({ role: "viewer" });
    await updateUser(getDb(), admin, { id: user.id, role: "support" });
    const promoted = await eventually(async () => {
      const res = await callRoute(getMe, { url: "/api/v1/me", token });
      const { role } = (await res.clone().json()) as { role: string };
      return role === "support" ? new Response(null, { status: 204 }) : res;
    }, 204);
    expect(promoted.status).toBe(204);
    await updateUser(getDb(), admin, { id: user.id, disabled: true });
    expect((await eventually(() => callRoute(getMe, { url: "/api/v1/me", token }), 401)).status).toBe(401);
  });
});
