// API tokens and exports, against OWASP ASVS 4.0.3:
// V3.5 token-based sessions and V3.3.1 revocation that holds (a disabled user's tokens stay
// dead; a stated maximum lifetime; a cap on live tokens),
// V4.2.1 (a direct object reference reveals nothing: unknown and someone else's token answer alike),
// V5.1.4 (JSON numbers are numbers: no coercion from strings, booleans or arrays),
// V5.3.1 output encoding for the interpreter that reads it — here the spreadsheet, following
// the OWASP "CSV Injection" guidance (prefix a single quote and quote the cell when a formula
// starter follows the start of the value or any separator, quote or whitespace).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq, sql } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "../support/db";
import { callRoute, tokenFor } from "../support/http";
import { builds, productionLots, users } from "@/db/schema";
import { updateUser } from "@/lib/use-cases/admin/users";
import * as meRoute from "@/app/api/v1/me/route";
import * as tokensRoute from "@/app/api/v1/tokens/route";
import * as tokenRoute from "@/app/api/v1/tokens/[id]/route";
import * as adminTokensRoute from "@/app/api/v1/admin/tokens/route";
import * as adminTokenRoute from "@/app/api/v1/admin/tokens/[id]/route";
import * as shippedRoute from "@/app/api/v1/support/withdrawn/[id]/shipped.csv/route";
import { MAX_LIVE_TOKENS, MAX_TOKEN_DAYS } from "@/lib/api/operations/account";
import { splitCsv } from "@/lib/csv/read";

process.env.LOOPKEEPER_LOG = "silent";
process.env.API_RATE_LIMIT_PER_MIN = "100000";

const json = (body: unknown) => ({ body: JSON.stringify(body), headers: { "content-type": "application/json" } });
let tempEmail = "";
let tempId = "";

beforeAll(async () => {
  tempEmail = `tokens-${Date.now()}@tarnwell.example`;
  const [row] = await getDb().insert(users).values({ email: tempEmail, name: "Token Holder", role: "engineer", passwordHash: "x" }).returning();
  tempId = row!.id;
});
afterAll(closeDb);

describe("ASVS 3.5 / 3.3.1 / 4.2.1 / 5.1.4 — token lifetime, cap and revocation", () => {
  it("a disabled user's tokens stay dead after the user is enabled again", async () => {
    const token = await tokenFor(tempEmail);
    expect((await callRoute(meRoute.GET, { url: "/api/v1/me", token })).status).toBe(200);
    const admin = await demoActor("admin@tarnwell.example");
    await updateUser(getDb(), admin, { id: tempId, disabled: true });
    expect((await callRoute(meRoute.GET, { url: "/api/v1/me", token })).status).toBe(401);
    await updateUser(getDb(), admin, { id: tempId, disabled: false });
    expect((await callRoute(meRoute.GET, { url: "/api/v1/me", token })).status).toBe(401);
  });

  it(`a token cannot outlive the stated policy (${MAX_TOKEN_DAYS} days), and its lifetime is a JSON number, never coerced`, async () => {
    const token = await tokenFor(tempEmail);
    const tooLong = await callRoute(tokensRoute.POST, { url: "/api/v1/tokens", method: "POST", token, ...json({ name: "long", expiresInDays: MAX_TOKEN_DAYS + 1 }) });
    expect(tooLong.status).toBe(422);
    expect(await tooLong.text()).toMatch(new RegExp(`At most ${MAX_TOKEN_DAYS} days`));
    for (const notANumber of ["30", true, [30]]) {
      const res = await callRoute(tokensRoute.POST, { url: "/api/v1/tokens", method: "POST", token, ...json({ name: "coerced", expiresInDays: notANumber }) });
      expect(res.status, JSON.stringify(notANumber)).toBe(422);
    }
  });

  it(`a user holds at most ${MAX_LIVE_TOKENS} live tokens`, async () => {
    const db = getDb();
    await db.execute(sql`update api_tokens set revoked_at = now() where user_id = ${tempId} and revoked_at is null`);
    const token = await tokenFor(tempEmail); // one live
    for (let i = 1; i < MAX_LIVE_TOKENS; i++) {
      const res = await callRoute(tokensRoute.POST, { url: "/api/v1/tokens", method: "POST", token, ...json({ name: `t${i}`, expiresInDays: 1 }) });
      expect(res.status).toBe(201);
    }
    const over = await callRoute(tokensRoute.POST, { url: "/api/v1/tokens", method: "POST", token, ...json({ name: "one too many", expiresInDays: 1 }) });
    expect(over.status).toBe(409);
    expect(await over.text()).toMatch(/revoke one/);
  });

  it("revoking an unknown token and someone else's token give the same answer", async () => {
    const mine = await tokenFor("viewer@tarnwell.example");
    const other = await tokenFor("support@tarnwell.example");
    const list = (await (await callRoute(tokensRoute.GET, { url: "/api/v1/tokens", token: other })).json()) as { items: { id: string }[] };
    const othersId = list.items[0]!.id;
    const unknownId = "00000000-0000-4000-8000-000000000001";
    const a = await callRoute(tokenRoute.DELETE, { url: `/api/v1/tokens/${othersId}`, method: "DELETE", token: mine, params: { id: othersId } });
    const b = await callRoute(tokenRoute.DELETE, { url: `/api/v1/tokens/${unknownId}`, method: "DELETE", token: mine, params: { id: unknownId } });
    expect(a.status).toBe(b.status);
    expect(((await a.json()) as { error: unknown }).error).toEqual(((await b.json()) as { error: unknown }).error);
    // And the other user's token still works.
    expect((await callRoute(meRoute.GET, { url: "/api/v1/me", token: other })).status).toBe(200);
  });
});

describe("ASVS 5.3.1 — CSV exports escape formula starters after any separator (OWASP CSV Injection)", () => {
  const HOSTILE = "L;=cmd|' /C calc'!A0";
  let lotId = "";
  let before = "";

  beforeAll(async () => {
    const db = getDb();
    const [{ lot } = { lot: undefined }] = await db
      .select({ lot: productionLots })
      .from(productionLots)
      .innerJoin(builds, eq(builds.id, productionLots.buildId))
      .where(eq(builds.stage, "withdrawn"))
      .limit(1);
    lotId = lot!.id;
    before = lot!.line;
    await db.update(productionLots).set({ line: HOSTILE }).where(eq(productionLots.id, lotId));
  });
  afterAll(async () => {
    await getDb().update(productionLots).set({ line: before }).where(eq(productionLots.id, lotId));
  });

  it("a cell like L;=cmd|' /C calc'!A0 is quoted and starts with a single quote", async () => {
    const db = getDb();
    const [lot] = await db.select().from(productionLots).where(eq(productionLots.id, lotId));
    const token = await tokenFor("support@tarnwell.example");
    const res = await callRoute(shippedRoute.GET, { url: `/api/v1/support/withdrawn/${lot!.buildId}/shipped.csv`, token, params: { id: lot!.buildId } });
    expect(res.status).toBe(200);
    expect(res.headers.get("cache-control")).toBe("no-store");
    const text = await res.text();
    expect(text).toContain(`"'${HOSTILE}"`);
    // Read back with the RFC 4180 reader: the field is the value with the quote prefix, nothing split off.
    const records = splitCsv(text);
    const field = records.flatMap((r) => r.fields).find((f) => f.includes("cmd"));
    expect(field).toBe(`'${HOSTILE}`);
    // Read the way a spreadsheet with ";" as list separator would: no resulting cell starts a formula.
    for (const line of text.split(/\r\n/)) {
      const cells = line.match(/("([^"]|"")*"|[^;,]*)/g) ?? [];
      for (const c of cells) expect(c.replace(/^"/, "")).not.toMatch(/^[=+\-@]/);
    }
  });

  it("answers only for withdrawn builds", async () => {
    const db = getDb();
    const [live] = await db.select().from(builds).where(and(eq(builds.stage, "production"))).limit(1);
    const token = await tokenFor("support@tarnwell.example");
    const res = await callRoute(shippedRoute.GET, { url: `/api/v1/support/withdrawn/${live!.id}/shipped.csv`, token, params: { id: live!.id } });
    expect(res.status).toBe(404);
  });
});

describe("ASVS 3.3.1 / 4.1.3 — admins list and revoke anyone's tokens; nobody else can", () => {
  it("an admin sees another user's live token with its owner and revokes it; the token stops at once and the revocation is audited", async () => {
    const victim = await tokenFor(tempEmail);
    expect((await callRoute(meRoute.GET, { url: "/api/v1/me", token: victim })).status).toBe(200);
    const admin = await tokenFor("admin@tarnwell.example");
    const listed = await callRoute(adminTokensRoute.GET, { url: "/api/v1/admin/tokens?live=true", token: admin });
    expect(listed.status).toBe(200);
    const items = ((await listed.json()) as { items: { id: string; userEmail: string; tokenPrefix: string }[] }).items.filter((t) => t.userEmail === tempEmail);
    expect(items.length).toBeGreaterThanOrEqual(1);
    const target = items.find((t) => victim.startsWith(t.tokenPrefix));
    if (!target) throw new Error("the admin list does not show the user's live token");

    // An engineer cannot use the admin route, even for a token of their own.
    const engineer = await tokenFor("engineer@tarnwell.example");
    expect((await callRoute(adminTokenRoute.DELETE, { url: `/api/v1/admin/tokens/${target.id}`, method: "DELETE", token: engineer, params: { id: target.id } })).status).toBe(403);

    const revoked = await callRoute(adminTokenRoute.DELETE, { url: `/api/v1/admin/tokens/${target.id}`, method: "DELETE", token: admin, params: { id: target.id } });
    expect(revoked.status).toBe(200);
    expect(((await revoked.json()) as { token: { revokedAt: string | null } }).token.revokedAt).not.toBeNull();
    // The token-to-person cache forgets it when PostgreSQL announces the change (LISTEN/NOTIFY): moments, not minutes.
    await expect.poll(async () => (await callRoute(meRoute.GET, { url: "/api/v1/me", token: victim })).status, { timeout: 5_000 }).toBe(401);
    const audit = await getDb().execute<{ n: number }>(sql`select count(*)::int as n from audit_events where action = 'token.revoke' and entity_id = ${target.id}`);
    expect(audit.rows[0]?.n).toBe(1);
  });
});
