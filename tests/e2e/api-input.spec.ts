import { expect, test } from "@playwright/test";
import { ACCOUNTS, signInRequest } from "./support/accounts";

/** Bad input to /api/v1 gets a 4xx with a JSON error that says what is wrong, never a 500. */
test.describe("API input handling", () => {
  test.beforeEach(async ({ request }) => {
    await signInRequest(request, ACCOUNTS.admin);
  });

  const cases: { name: string; headers?: Record<string, string>; data: string; status: number; message: RegExp }[] = [
    { name: "malformed JSON", data: '{"name": "x",', status: 400, message: /not valid JSON/ },
    { name: "empty body", data: "", status: 400, message: /empty/ },
    { name: "wrong types", data: JSON.stringify({ name: 42, expiresInDays: "soon" }), status: 422, message: /not valid/ },
    { name: "unknown fields", data: JSON.stringify({ name: "ci", expiresInDays: 5, isAdmin: true }), status: 422, message: /not valid/ },
    { name: "oversized body", data: JSON.stringify({ name: "x".repeat(300 * 1024), expiresInDays: 5 }), status: 413, message: /larger than/ },
    { name: "not JSON content type", headers: { "content-type": "text/plain" }, data: "name=x", status: 415, message: /Content-Type: application\/json/ },
    { name: "array instead of object", data: "[1,2,3]", status: 422, message: /not valid/ },
    { name: "__proto__ key", data: '{"__proto__": {"role": "admin"}, "name": "p", "expiresInDays": 1}', status: 422, message: /not valid/ },
  ];

  for (const c of cases) {
    test(c.name, async ({ request }) => {
      const res = await request.post("/api/v1/tokens", { headers: { "content-type": "application/json", ...c.headers }, data: Buffer.from(c.data) });
      expect(res.status()).toBe(c.status);
      const body = (await res.json()) as { error: { code: string; message: string } };
      expect(body.error.message).toMatch(c.message);
    });
  }

  test("field issues point at the field", async ({ request }) => {
    const res = await request.post("/api/v1/tokens", { data: { name: "", expiresInDays: 0 } });
    expect(res.status()).toBe(422);
    const body = (await res.json()) as { error: { issues: { path: string }[] } };
    expect(body.error.issues.map((i) => i.path).sort()).toEqual(["/expiresInDays", "/name"]);
  });

  test("a bad id in the path is a 400, not a 500", async ({ request }) => {
    const res = await request.delete("/api/v1/tokens/not-a-uuid");
    expect(res.status()).toBe(400);
  });

  test("an API token acts as its user and role, and stops working when revoked", async ({ request, playwright, baseURL }) => {
    const created = (await (await request.post("/api/v1/tokens", { data: { name: "e2e station", expiresInDays: 1 } })).json()) as {
      token: { id: string };
      secret: string;
    };
    const station = await playwright.request.newContext({ baseURL, extraHTTPHeaders: { authorization: `Bearer ${created.secret}` } });
    const me = (await (await station.get("/api/v1/me")).json()) as { email: string; role: string; via: string };
    expect(me).toMatchObject({ email: ACCOUNTS.admin, role: "admin", via: "token" });
    const listed = (await (await request.get("/api/v1/tokens")).json()) as { items: { id: string; lastUsedAt: string | null }[] };
    expect(listed.items.find((t) => t.id === created.token.id)?.lastUsedAt).not.toBeNull();
    expect(JSON.stringify(listed)).not.toContain(created.secret);
    await request.delete(`/api/v1/tokens/${created.token.id}`);
    expect((await station.get("/api/v1/me")).status()).toBe(401);
    await station.dispose();
  });

  test("the OpenAPI document lists the operations with their schemas", async ({ request }) => {
    const doc = (await (await request.get("/api/v1/openapi.json")).json()) as { openapi: string; paths: Record<string, Record<string, { operationId: string; requestBody?: unknown }>> };
    expect(doc.openapi).toBe("3.1.0");
    expect(doc.paths["/api/v1/tokens"]?.post?.operationId).toBe("createToken");
    expect(doc.paths["/api/v1/tokens"]?.post?.requestBody).toBeTruthy();
    expect(doc.paths["/api/v1/users/{id}"]?.patch?.operationId).toBe("updateUser");
  });

  test("security headers: CSP self only, no framing", async ({ request }) => {
    const res = await request.get("/sign-in");
    const csp = res.headers()["content-security-policy"] ?? "";
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("frame-ancestors 'none'");
    expect(res.headers()["x-frame-options"]).toBe("DENY");
  });
});
