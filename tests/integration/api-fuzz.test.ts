import fs from "node:fs";
import path from "node:path";
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { Ajv2020 } from "ajv/dist/2020";
import addFormats from "ajv-formats";
import { sql } from "drizzle-orm";
import { z } from "zod";
import { closeDb, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { arbitraryFromSchema, hostileBody } from "./support/schema-arbitrary";
import { allOperations } from "@/lib/api/operations";
import { isJsonResponse, type Operation } from "@/lib/api/operation";
import { buildOpenApi } from "@/lib/api/openapi";
import { CAPABILITIES, ROLES, type Role } from "@/lib/auth/roles";

// The fuzz run sends thousands of requests per token; the per-token budget is tested elsewhere.
process.env.API_RATE_LIMIT_PER_MIN = "100000000";
process.env.LOOPKEEPER_LOG = "silent";

const ACCOUNTS: Record<Role, string> = {
  admin: "admin@tarnwell.example",
  engineer: "engineer@tarnwell.example",
  release_manager: "release@tarnwell.example",
  support: "support@tarnwell.example",
  viewer: "viewer@tarnwell.example",
};
const RUNS_PER_OPERATION = Number(process.env.FUZZ_RUNS ?? 150);

type Handler = Parameters<typeof callRoute>[0];

/** The route module that serves an operation: /api/v1/users/{id} → app/api/v1/users/[id]/route.ts. */
function routeFile(op: Operation): string {
  return path.join(process.cwd(), "app", ...op.path.replace(/^\//, "").split("/").map((seg) => seg.replace(/^\{(.+)\}$/, "[$1]")), "route.ts");
}

function allowedRoles(op: Operation): readonly Role[] {
  if (op.access === "public" || op.access === "signed_in") return ROLES;
  return CAPABILITIES[op.access];
}

function inputSchema(t: z.ZodType | undefined) {
  return t ? (z.toJSONSchema(t, { io: "input", unrepresentable: "any" }) as Parameters<typeof arbitraryFromSchema>[0]) : undefined;
}

const tokens = {} as Record<Role, string>;
const stats = { cases: 0, byStatus: {} as Record<number, number>, successBodiesValidated: {} as Record<string, number> };

// Success bodies are checked against the OpenAPI document an outside client reads (draft 2020-12,
// JSON Schema validation by Ajv), not against the zod schemas the server built them from.
const openApi = buildOpenApi(allOperations, "fuzz") as { paths: Record<string, Record<string, { responses: Record<string, { content?: Record<string, { schema: object }> }> }>> };
const ajv = new Ajv2020({ strict: false, allErrors: true });
addFormats(ajv);
function successValidator(op: Operation) {
  if (!isJsonResponse(op.response)) return null;
  const schema = openApi.paths[op.path]?.[op.method.toLowerCase()]?.responses[String(op.successStatus ?? 200)]?.content?.["application/json"]?.schema;
  if (!schema) throw new Error(`${op.id}: the OpenAPI document has no JSON schema for its success body`);
  return ajv.compile(schema);
}

/** Real ids per path, so fuzzed reads also reach rows that exist and answer 2xx (writes get none: they would disable the callers). */
const TABLE_OF_PATH: [RegExp, string][] = [
  [/^\/api\/v1\/users\//, "users"],
  [/^\/api\/v1\/tokens\//, "api_tokens"],
  [/^\/api\/v1\/(builds|support\/withdrawn)\//, "builds"],
  [/^\/api\/v1\/profiles\//, "profiles"],
  [/^\/api\/v1\/profile-versions\//, "profile_versions"],
  [/^\/api\/v1\/board-models\//, "board_models"],
  [/^\/api\/v1\/board-revisions\//, "board_revisions"],
  [/^\/api\/v1\/components\//, "components"],
  [/^\/api\/v1\/cooler-models\//, "cooler_models"],
];
const realIds: Record<string, string[]> = {};

/** GET operations whose success depends on more than a real id (a shipped serial), reached by their own tests. */
const SUCCESS_NOT_EXPECTED = new Set(["lookupSerial"]);

beforeAll(async () => {
  for (const role of ROLES) tokens[role] = await tokenFor(ACCOUNTS[role]);
  for (const [, table] of TABLE_OF_PATH) {
    const rows = await getDb().execute<{ id: string }>(sql.raw(`select id::text as id from ${table} order by 1 limit 20`));
    realIds[table] = rows.rows.map((r) => r.id);
  }
});

afterAll(async () => {
  await closeDb();
  const dir = path.join(process.cwd(), ".data");
  fs.mkdirSync(dir, { recursive: true });
  fs.writeFileSync(path.join(dir, "fuzz-stats.json"), JSON.stringify(stats, null, 2));
});

describe("API fuzz from the operation list (valid, invalid and hostile inputs)", () => {
  it("every operation has a route file", () => {
    const missing = allOperations.filter((op) => !fs.existsSync(routeFile(op))).map((op) => `${op.method} ${op.path}`);
    expect(missing).toEqual([]);
  });

  for (const op of allOperations.filter((o) => !o.rawBody)) {
    it(`${op.method} ${op.path}: never a 500, refusals are JSON, no data for roles without access`, async () => {
      const mod = (await import(routeFile(op))) as Record<string, Handler>;
      const handler = mod[op.method];
      expect(handler, `route exports ${op.method}`).toBeTypeOf("function");
      const paramsSchema = inputSchema(op.params);
      const querySchema = inputSchema(op.query);
      const bodySchema = inputSchema(op.body);
      const who = fc.oneof(
        { weight: 5, arbitrary: fc.constantFrom(...ROLES).map((r) => ({ role: r, token: tokens[r] })) },
        { weight: 1, arbitrary: fc.constantFrom("Bearer nope", "Bearer lk_" + "x".repeat(43), "Basic YWRtaW46YWRtaW4=", "Bearer ").map((h) => ({ role: null, token: h.replace(/^Bearer /, ""), raw: h })) },
      );
      const table = TABLE_OF_PATH.find(([re]) => re.test(op.path))?.[1];
      const ids = table && op.method === "GET" ? (realIds[table] ?? []) : [];
      const params = paramsSchema
        ? fc.oneof(
            arbitraryFromSchema(paramsSchema),
            fc.record({ id: fc.string({ maxLength: 50 }) }),
            ...(ids.length > 0 ? [{ weight: 4, arbitrary: fc.constantFrom(...ids).map((id) => ({ id })) }] : []),
          )
        : fc.constant({});
      const validate = successValidator(op);
      const query = querySchema ? fc.oneof(arbitraryFromSchema(querySchema), fc.dictionary(fc.string({ maxLength: 12 }), fc.string({ maxLength: 20 }))) : fc.constant({});
      const body = bodySchema ? fc.oneof({ weight: 3, arbitrary: arbitraryFromSchema(bodySchema) }, { weight: 2, arbitrary: hostileBody }) : fc.constant(undefined);
      const rawText = fc.option(fc.oneof(fc.string({ maxLength: 60 }), fc.constant("{"), fc.constant("")), { freq: 5 });

      await fc.assert(
        fc.asyncProperty(who, params, query, body, rawText, async (caller, p, q, b, raw) => {
          const url = new URL(`http://127.0.0.1:3000${op.path.replace(/\{(\w+)\}/g, (_, k: string) => encodeURIComponent(JSON.stringify((p as Record<string, unknown>)[k] ?? "x").replace(/^"|"$/g, "")))}`);
          for (const [k, v] of Object.entries((q ?? {}) as Record<string, unknown>)) if (v !== undefined) url.searchParams.set(k, typeof v === "string" ? v : JSON.stringify(v));
          const hasBody = op.method !== "GET" && op.method !== "DELETE";
          const res = await callRoute(handler!, {
            url: url.pathname + url.search,
            method: op.method,
            headers: { authorization: "raw" in caller ? String(caller.raw) : `Bearer ${caller.token}`, ...(hasBody ? { "content-type": "application/json" } : {}) },
            body: hasBody ? (raw ?? JSON.stringify(b ?? {})) : undefined,
            params: Object.fromEntries(Object.entries((p ?? {}) as Record<string, unknown>).map(([k, v]) => [k, String(v)])),
          });
          stats.cases++;
          stats.byStatus[res.status] = (stats.byStatus[res.status] ?? 0) + 1;
          expect(res.status, `${op.method} ${url.pathname} answered ${res.status}`).not.toBe(500);
          expect(res.status).toBeLessThan(500);
          if (caller.role === null && op.access !== "public") expect(res.status).toBe(401);
          if (caller.role !== null && !allowedRoles(op).includes(caller.role)) expect(res.status).toBe(403);
          if (res.status >= 200 && res.status < 300 && validate) {
            const json: unknown = await res.json();
            const valid = validate(json);
            expect(valid, `${op.method} ${url.pathname} answered ${res.status} with a body outside its response schema: ${ajv.errorsText(validate.errors)}`).toBe(true);
            stats.successBodiesValidated[op.id] = (stats.successBodiesValidated[op.id] ?? 0) + 1;
          }
          if (res.status >= 400) {
            const json = (await res.json()) as { error?: { code?: string; message?: string } };
            expect(json.error?.code).toBeTypeOf("string");
            expect(json.error?.message).toBeTypeOf("string");
          }
        }),
        { numRuns: RUNS_PER_OPERATION, endOnFailure: true },
      );
    }, 120_000);
  }

  it("every JSON GET operation answered 2xx at least once and its body matched the OpenAPI response schema", () => {
    const unreached = allOperations
      .filter((op) => op.method === "GET" && !op.rawBody && isJsonResponse(op.response) && !SUCCESS_NOT_EXPECTED.has(op.id))
      .filter((op) => !stats.successBodiesValidated[op.id])
      .map((op) => op.id);
    expect(unreached).toEqual([]);
  });
});
