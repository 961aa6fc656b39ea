import { createHash, randomBytes } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import { expect, request as playwrightRequest, test, type APIRequestContext } from "@playwright/test";
import { Client } from "pg";
import { ALL_ROWS } from "./access/rows";
import { ROLES, type AccessRow, type RoleName } from "./access/types";
import { ACCOUNTS, signInRequest } from "./support/accounts";

const METHODS = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;

function walk(dir: string): string[] {
  return fs.readdirSync(dir, { withFileTypes: true }).flatMap((e) => (e.isDirectory() ? walk(path.join(dir, e.name)) : [path.join(dir, e.name)]));
}

/** Every (file, method) the app serves: pages answer GET; route files export their methods. */
function servedEndpoints(): { file: string; method: string }[] {
  const out: { file: string; method: string }[] = [];
  for (const abs of walk(path.join(process.cwd(), "app"))) {
    const file = path.relative(process.cwd(), abs).split(path.sep).join("/");
    if (/\/page\.tsx$/.test(file)) out.push({ file, method: "GET" });
    if (/\/route\.ts$/.test(file)) {
      const src = fs.readFileSync(abs, "utf8");
      for (const m of METHODS) {
        if (new RegExp(`export (const|async function|function) ${m}\\b|as ${m}\\b`).test(src)) out.push({ file, method: m });
      }
    }
  }
  return out;
}

function expectedStatuses(row: AccessRow, who: RoleName | "anon" | "revoked" | "expired"): number[] {
  const ok = row.ok === undefined ? [200] : Array.isArray(row.ok) ? row.ok : [row.ok];
  if (row.allowed === "public") return ok;
  if (who === "anon" || who === "revoked" || who === "expired") return row.kind === "page" ? [307] : [401];
  const allowed = row.allowed === "all" || row.allowed.includes(who);
  return allowed ? ok : [403];
}

async function call(ctx: APIRequestContext, row: AccessRow, headers: Record<string, string> = {}) {
  return ctx.fetch(row.url, {
    method: row.method,
    headers: { ...(row.body !== undefined ? { "content-type": "application/json" } : {}), ...headers },
    data: row.body !== undefined ? JSON.stringify(row.body) : undefined,
    maxRedirects: 0,
  });
}

test("every page and route has a row in the role matrix", () => {
  const covered = new Set(ALL_ROWS.map((r) => `${r.method} ${r.file}`));
  const missing = servedEndpoints()
    .map((e) => `${e.method} ${e.file}`)
    .filter((k) => !covered.has(k));
  expect(missing, "add a row for each of these to tests/e2e/access").toEqual([]);
  // And no row points at a file that no longer exists.
  const stale = ALL_ROWS.filter((r) => !fs.existsSync(path.join(process.cwd(), r.file))).map((r) => r.file);
  expect(stale).toEqual([]);
});

test.describe("role matrix", () => {
  const contexts = new Map<string, APIRequestContext>();
  let revokedToken = "";
  let expiredToken = "";

  test.beforeAll(async ({ baseURL }) => {
    contexts.set("anon", await playwrightRequest.newContext({ baseURL }));
    for (const role of ROLES) {
      const ctx = await playwrightRequest.newContext({ baseURL });
      await signInRequest(ctx, ACCOUNTS[role]);
      contexts.set(role, ctx);
    }
    // A token revoked through the API, and one whose expiry has passed (written directly).
    const viewer = contexts.get("viewer")!;
    const created = (await (await viewer.post("/api/v1/tokens", { data: { name: "matrix revoked", expiresInDays: 1 } })).json()) as {
      token: { id: string };
      secret: string;
    };
    expect((await viewer.delete(`/api/v1/tokens/${created.token.id}`)).status()).toBe(200);
    revokedToken = created.secret;
    expiredToken = `lk_${randomBytes(32).toString("base64url")}`;
    const db = new Client({ connectionString: process.env.DATABASE_URL });
    await db.connect();
    await db.query(
      `insert into api_tokens (user_id, name, token_hash, token_prefix, expires_at)
       select id, 'matrix expired', $1, $2, now() - interval '1 day' from users where email = $3`,
      [createHash("sha256").update(expiredToken).digest("hex"), expiredToken.slice(0, 10), ACCOUNTS.admin],
    );
    await db.end();
  });

  test.afterAll(async () => {
    for (const ctx of contexts.values()) await ctx.dispose();
  });

  for (const row of ALL_ROWS) {
    test(`${row.method} ${row.url}`, async () => {
      const results: string[] = [];
      const check = async (who: RoleName | "anon" | "revoked" | "expired", ctx: APIRequestContext, headers?: Record<string, string>) => {
        const res = await call(ctx, row, headers);
        const want = expectedStatuses(row, who);
        if (!want.includes(res.status())) results.push(`${who}: got ${res.status()}, want ${want.join("|")}`);
        if (row.kind === "api" && res.status() >= 400 && row.file.startsWith("app/api/v1")) {
          const body = (await res.json().catch(() => null)) as { error?: { code?: string } } | null;
          if (!body?.error?.code) results.push(`${who}: ${res.status()} without a JSON error`);
        }
      };
      await check("anon", contexts.get("anon")!);
      for (const role of ROLES) await check(role, contexts.get(role)!);
      if (row.allowed !== "public") {
        await check("revoked", contexts.get("anon")!, { authorization: `Bearer ${revokedToken}` });
        await check("expired", contexts.get("anon")!, { authorization: `Bearer ${expiredToken}` });
      }
      expect(results).toEqual([]);
    });
  }
});
