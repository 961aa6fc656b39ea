// Input hardening at the API boundary, against OWASP ASVS 4.0.3:
// V7.4.1 (generic error messages: no SQL, constraint names or PostgreSQL detail),
// V5.1.3/V5.1.4 (input validated at the boundary: characters, structure, depth),
// V5.1.1 (HTTP parameter pollution: one value per query parameter).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb, getDb } from "../support/db";
import { callRoute, tokenFor } from "../support/http";
import { coolerModels } from "@/db/schema";
import * as profilesRoute from "@/app/api/v1/profiles/route";
import * as draftRoute from "@/app/api/v1/profiles/[id]/draft/route";
import * as profileRoute from "@/app/api/v1/profiles/[id]/route";
import * as tokensRoute from "@/app/api/v1/tokens/route";
import * as auditRoute from "@/app/api/v1/audit/route";
import * as lotsRoute from "@/app/api/v1/lots/route";
import * as lotImportRoute from "@/app/api/v1/lots/import/route";
import * as buildsRoute from "@/app/api/v1/builds/route";

process.env.LOOPKEEPER_LOG = "silent";

/** Text that only the database or its driver would write: it must never reach a client. */
const DATABASE_TEXT = /\b(select|insert|update|delete)\b.+\b(from|into|set|where)\b|_key\b|_fk\b|_pk\b|constraint|duplicate key|Key \(|violates|invalid byte sequence|0x00|postgres|\$\d+|params:/i;

let engineer = "";
let admin = "";
let release = "";
let coolerModelId = "";
const stamp = Date.now();

beforeAll(async () => {
  engineer = await tokenFor("engineer@tarnwell.example");
  admin = await tokenFor("admin@tarnwell.example");
  release = await tokenFor("release@tarnwell.example");
  const [cm] = await getDb().select({ id: coolerModels.id }).from(coolerModels).limit(1);
  coolerModelId = cm!.id;
});
afterAll(closeDb);

const json = (body: unknown) => ({ body: JSON.stringify(body), headers: { "content-type": "application/json" } });

async function text(res: Response): Promise<string> {
  return res.text();
}

describe("ASVS 7.4.1 — no SQL, constraint names or PostgreSQL detail in any answer", () => {
  it("a duplicate profile name is a 409 that says in words what already exists", async () => {
    const body = { coolerModelId, name: `Quiet ${stamp}`, description: "" };
    const first = await callRoute(profilesRoute.POST, { url: "/api/v1/profiles", method: "POST", token: engineer, ...json(body) });
    expect(first.status).toBe(201);
    const again = await callRoute(profilesRoute.POST, { url: "/api/v1/profiles", method: "POST", token: engineer, ...json(body) });
    expect(again.status).toBe(409);
    const raw = await text(again);
    expect(raw).not.toMatch(DATABASE_TEXT);
    expect(raw).toMatch(/already has a profile with this name/);
  });
});

describe("ASVS 5.1.3 — NUL and other control characters are refused where they enter (400/422, never 500)", () => {
  it.each([
    ["token name", () => callRoute(tokensRoute.POST, { url: "/api/v1/tokens", method: "POST", token: engineer, ...json({ name: "ci\u0000runner", expiresInDays: 30 }) })],
    ["profile name", () => callRoute(profilesRoute.POST, { url: "/api/v1/profiles", method: "POST", token: engineer, ...json({ coolerModelId, name: "Nul\u0000name", description: "" }) })],
    ["profile description (C0 control)", () => callRoute(profilesRoute.POST, { url: "/api/v1/profiles", method: "POST", token: engineer, ...json({ coolerModelId, name: "Bell", description: "ring\u0007" }) })],
    ["audit filter", () => callRoute(auditRoute.GET, { url: "/api/v1/audit?action=token.%00create", token: admin })],
    ["lot filter", () => callRoute(lotsRoute.GET, { url: "/api/v1/lots?code=TW%00", token: release })],
  ])("%s", async (_what, call) => {
    const res = await call();
    expect([400, 422]).toContain(res.status);
    const body = (await res.json()) as { error: { message: string; issues?: { message: string }[] } };
    expect(JSON.stringify(body)).toMatch(/NUL character|control character/);
    expect(JSON.stringify(body)).not.toMatch(DATABASE_TEXT);
  });

  it("draft text with a NUL is refused with its position", async () => {
    const created = await callRoute(profilesRoute.POST, { url: "/api/v1/profiles", method: "POST", token: engineer, ...json({ coolerModelId, name: `Nul draft ${stamp}`, description: "" }) });
    const { profile } = (await created.json()) as { profile: { id: string } };
    const res = await callRoute(draftRoute.PUT, { url: `/api/v1/profiles/${profile.id}/draft`, method: "PUT", token: engineer, params: { id: profile.id }, ...json({ text: '{"name":"a\u0000b"}' }) });
    expect(res.status).toBe(422);
    expect(await text(res)).toMatch(/NUL character \(U\+0000\) at position 11/);
  });

  it("a lot import with a NUL is refused alike by the dry run and the commit", async () => {
    const csv = `lot_code,board_revision,build_version,serial_from,serial_to,produced_on,line\nNUL-${stamp % 10000},1.1.0,3.0.0,TC1-95000000,TC1-95000010,2025-04-01,Line\u0000A\n`;
    const run = (dryRun: boolean) =>
      callRoute(lotImportRoute.POST, { url: `/api/v1/lots/import?dryRun=${dryRun}`, method: "POST", token: release, body: csv, headers: { "content-type": "text/csv" } });
    const dry = await run(true);
    const commit = await run(false);
    expect(dry.status).toBe(commit.status);
    expect(commit.status).toBeLessThan(500);
    const dryBody = (await dry.json()) as { committed: number; issues: { row: number; column: string; message: string }[] };
    const commitBody = (await commit.json()) as { committed: number; issues: { row: number; column: string; message: string }[] };
    expect(commitBody.committed).toBe(0);
    expect(dryBody.issues).toEqual(commitBody.issues);
    expect(commitBody.issues).toContainEqual(expect.objectContaining({ row: 2, column: "line", message: expect.stringMatching(/NUL character/) }));
  });
});

describe("ASVS 5.1.4 — drafts meet the same depth and size limits as imports, before deep parsing", () => {
  it("a 12 KB draft nested 6,000 levels and one nested 4,000 levels are refused, and reads stay small", async () => {
    const created = await callRoute(profilesRoute.POST, { url: "/api/v1/profiles", method: "POST", token: engineer, ...json({ coolerModelId, name: `Deep ${stamp}`, description: "" }) });
    const { profile } = (await created.json()) as { profile: { id: string } };
    for (const levels of [6000, 4000]) {
      const deep = "[".repeat(levels) + "]".repeat(levels);
      const res = await callRoute(draftRoute.PUT, { url: `/api/v1/profiles/${profile.id}/draft`, method: "PUT", token: engineer, params: { id: profile.id }, ...json({ text: deep }) });
      expect(res.status).toBe(422);
      expect(await text(res)).toMatch(/nested deeper than 32 levels/);
    }
    // A body nested deeply as JSON itself is refused before it is parsed.
    const nestedBody = `{"text":${"[".repeat(5000)}${"]".repeat(5000)}}`;
    const res = await callRoute(draftRoute.PUT, { url: `/api/v1/profiles/${profile.id}/draft`, method: "PUT", token: engineer, params: { id: profile.id }, body: nestedBody, headers: { "content-type": "application/json" } });
    expect(res.status).toBe(422);
    const read = await callRoute(profileRoute.GET, { url: `/api/v1/profiles/${profile.id}`, token: engineer, params: { id: profile.id } });
    expect(read.status).toBe(200);
    expect((await read.arrayBuffer()).byteLength).toBeLessThan(200_000);
  });
});

describe("ASVS 5.1.1 — HTTP parameter pollution", () => {
  it("a query parameter sent twice is refused", async () => {
    const res = await callRoute(lotsRoute.GET, { url: "/api/v1/lots?code=TW&code=XX", token: release });
    expect(res.status).toBe(400);
    expect(await text(res)).toMatch(/more than once/);
  });
});

describe("ASVS 5.1.4 — a build version is three numbers 0–255, as its message says", () => {
  it.each(["1.256.0", "256.0.0", "1.0.999", "01.2.3"])("%s is refused with the message that names the rule", async (version) => {
    const res = await callRoute(buildsRoute.POST, { url: "/api/v1/builds", method: "POST", token: release, ...json({ version, boardModelId: "00000000-0000-4000-8000-000000000000", slots: [] }) });
    expect([400, 422]).toContain(res.status);
    expect(await text(res)).toMatch(/each 0–255/);
  });
  it("255.255.255 passes the version rule (the answer complains about other fields only)", async () => {
    const res = await callRoute(buildsRoute.POST, { url: "/api/v1/builds", method: "POST", token: release, ...json({ version: "255.255.255", boardModelId: "00000000-0000-4000-8000-000000000000", slots: [] }) });
    expect(await text(res)).not.toMatch(/each 0–255/);
  });
});
