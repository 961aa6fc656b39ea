import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { auditEvents, boardModels, boardRevisions, components, coolerModels } from "@/db/schema";
import { createBoardModel } from "@/lib/use-cases/registry/save-board-model";
import { createBoardRevision } from "@/lib/use-cases/registry/save-board-revision";
import { createCoolerModel } from "@/lib/use-cases/registry/save-cooler-model";
import * as coolerRoute from "@/app/api/v1/cooler-models/[id]/route";
import * as boardModelRoute from "@/app/api/v1/board-models/[id]/route";
import * as revisionRoute from "@/app/api/v1/board-revisions/[id]/route";

afterAll(closeDb);

const tag = () => `${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`.toUpperCase();
const json = (v: unknown) => JSON.stringify(v);
const JSON_HEADERS = { "content-type": "application/json" };
let engineer = "";
let viewer = "";

beforeAll(async () => {
  engineer = await tokenFor("engineer@tarnwell.example");
  viewer = await tokenFor("viewer@tarnwell.example");
});

async function auditOf(action: string, entityId: string) {
  return getDb().select().from(auditEvents).where(and(eq(auditEvents.action, action), eq(auditEvents.entityId, entityId)));
}

async function freshCooler() {
  const db = getDb();
  const actor = await demoActor("engineer@tarnwell.example");
  const [fan] = await db.select().from(components).where(eq(components.name, "Fellwind 120 PWM fan"));
  const [pump] = await db.select().from(components).where(eq(components.name, "Brook D3 pump"));
  const [board] = await db.select().from(boardModels).where(eq(boardModels.name, "TC-1 cooler controller"));
  const body = {
    name: `Test cooler ${tag()}`,
    radiatorMm: 240,
    fanComponentId: fan!.id,
    fanCount: 2,
    pumpComponentId: pump!.id,
    boardModelId: board!.id,
    radiatorKPerWAtMinFan: 0.12,
    radiatorKPerWAtMaxFan: 0.06,
  };
  const cooler = await createCoolerModel(db, actor, body);
  return { cooler, body };
}

async function freshBoard() {
  const db = getDb();
  const actor = await demoActor("engineer@tarnwell.example");
  const t = tag();
  const model = await createBoardModel(db, actor, { name: `Test board ${t}`, serialPrefix: `T${t.slice(-6)}`, description: "" });
  const revBody = { revision: "1.0.0", memoryBytes: 512, baseAddress: 0x0801f800, slotCount: 2, maxPointsPerCurve: 8, pwmFrequencyHz: 25000, tachPulsesPerRev: 2, notes: "" };
  const revision = await createBoardRevision(db, actor, { boardModelId: model.id, ...revBody });
  return { model, revision, revBody };
}

describe("PUT /api/v1/cooler-models/{id}", () => {
  it("updates the cooler model and audits before and after in the same write", async () => {
    const { cooler, body } = await freshCooler();
    const put = await callRoute(coolerRoute.PUT, { url: `/api/v1/cooler-models/${cooler.id}`, method: "PUT", token: engineer, params: { id: cooler.id }, headers: JSON_HEADERS, body: json({ ...body, fanCount: 3, radiatorMm: 360 }) });
    expect(put.status).toBe(200);
    const out = (await put.json()) as { coolerModel: { fanCount: number; radiatorMm: number; fanName: string } };
    expect(out.coolerModel).toMatchObject({ fanCount: 3, radiatorMm: 360, fanName: "Fellwind 120 PWM fan" });
    const [row] = await getDb().select().from(coolerModels).where(eq(coolerModels.id, cooler.id));
    expect(row!.fanCount).toBe(3);
    const events = await auditOf("cooler_model.update", cooler.id);
    expect(events).toHaveLength(1);
    expect(events[0]!.before).toMatchObject({ fanCount: 2, radiatorMm: 240 });
    expect(events[0]!.after).toMatchObject({ fanCount: 3, radiatorMm: 360 });
  });

  it("refuses an invalid body with 422 and field issues, changing nothing", async () => {
    const { cooler, body } = await freshCooler();
    const put = await callRoute(coolerRoute.PUT, {
      url: `/api/v1/cooler-models/${cooler.id}`,
      method: "PUT",
      token: engineer,
      params: { id: cooler.id },
      headers: JSON_HEADERS, body: json({ ...body, radiatorKPerWAtMinFan: 0.05, radiatorKPerWAtMaxFan: 0.09 }),
    });
    expect(put.status).toBe(422);
    const err = (await put.json()) as { error: { issues: { path: string }[] } };
    expect(err.error.issues.map((i) => i.path)).toContain("/radiatorKPerWAtMaxFan");
    const unknown = await callRoute(coolerRoute.PUT, { url: `/api/v1/cooler-models/${cooler.id}`, method: "PUT", token: engineer, params: { id: cooler.id }, headers: JSON_HEADERS, body: json({ ...body, colour: "red" }) });
    expect(unknown.status).toBe(422);
    expect(await auditOf("cooler_model.update", cooler.id)).toHaveLength(0);
  });

  it("answers 403 to a viewer", async () => {
    const { cooler, body } = await freshCooler();
    const put = await callRoute(coolerRoute.PUT, { url: `/api/v1/cooler-models/${cooler.id}`, method: "PUT", token: viewer, params: { id: cooler.id }, headers: JSON_HEADERS, body: json({ ...body, fanCount: 4 }) });
    expect(put.status).toBe(403);
    expect(await auditOf("cooler_model.update", cooler.id)).toHaveLength(0);
  });

  it("maps the unique name constraint to a message that says what to change", async () => {
    const { cooler, body } = await freshCooler();
    const put = await callRoute(coolerRoute.PUT, { url: `/api/v1/cooler-models/${cooler.id}`, method: "PUT", token: engineer, params: { id: cooler.id }, headers: JSON_HEADERS, body: json({ ...body, name: "Tarn 240" }) });
    expect(put.status).toBe(409);
    const err = (await put.json()) as { error: { message: string; issues: { path: string }[] } };
    expect(err.error.message).toMatch(/already has this name/);
    expect(err.error.issues[0]!.path).toBe("/name");
  });

  it("keeps the board model of a cooler that has profiles", async () => {
    const db = getDb();
    const [tarn] = await db.select().from(coolerModels).where(eq(coolerModels.name, "Tarn 240"));
    const { model } = await freshBoard();
    const body = {
      name: tarn!.name,
      radiatorMm: tarn!.radiatorMm,
      fanComponentId: tarn!.fanComponentId,
      fanCount: tarn!.fanCount,
      pumpComponentId: tarn!.pumpComponentId,
      boardModelId: model.id,
      radiatorKPerWAtMinFan: tarn!.radiatorKPerWAtMinFan,
      radiatorKPerWAtMaxFan: tarn!.radiatorKPerWAtMaxFan,
    };
    const put = await callRoute(coolerRoute.PUT, { url: `/api/v1/cooler-models/${tarn!.id}`, method: "PUT", token: engineer, params: { id: tarn!.id }, headers: JSON_HEADERS, body: json(body) });
    expect(put.status).toBe(409);
    const [after] = await db.select().from(coolerModels).where(eq(coolerModels.id, tarn!.id));
    expect(after!.boardModelId).toBe(tarn!.boardModelId);
  });
});

describe("PUT /api/v1/board-revisions/{id}", () => {
  it("updates the revision's limits and audits before and after", async () => {
    const { revision, revBody } = await freshBoard();
    const put = await callRoute(revisionRoute.PUT, { url: `/api/v1/board-revisions/${revision.id}`, method: "PUT", token: engineer, params: { id: revision.id }, headers: JSON_HEADERS, body: json({ ...revBody, memoryBytes: 1024, notes: "Larger flash page" }) });
    expect(put.status).toBe(200);
    expect(((await put.json()) as { revision: { memoryBytes: number } }).revision.memoryBytes).toBe(1024);
    const events = await auditOf("board_revision.update", revision.id);
    expect(events).toHaveLength(1);
    expect(events[0]!.before).toMatchObject({ memoryBytes: 512, notes: "" });
    expect(events[0]!.after).toMatchObject({ memoryBytes: 1024, notes: "Larger flash page" });
  });

  it("refuses an invalid body with 422 and a viewer with 403, changing nothing", async () => {
    const { revision, revBody } = await freshBoard();
    const bad = await callRoute(revisionRoute.PUT, { url: `/api/v1/board-revisions/${revision.id}`, method: "PUT", token: engineer, params: { id: revision.id }, headers: JSON_HEADERS, body: json({ ...revBody, revision: "two", slotCount: 40 }) });
    expect(bad.status).toBe(422);
    const paths = ((await bad.json()) as { error: { issues: { path: string }[] } }).error.issues.map((i) => i.path);
    expect(paths).toEqual(expect.arrayContaining(["/revision", "/slotCount"]));
    const denied = await callRoute(revisionRoute.PUT, { url: `/api/v1/board-revisions/${revision.id}`, method: "PUT", token: viewer, params: { id: revision.id }, headers: JSON_HEADERS, body: json({ ...revBody, memoryBytes: 2048 }) });
    expect(denied.status).toBe(403);
    const [row] = await getDb().select().from(boardRevisions).where(eq(boardRevisions.id, revision.id));
    expect(row!.memoryBytes).toBe(512);
    expect(await auditOf("board_revision.update", revision.id)).toHaveLength(0);
  });

  it("answers a clash with a sibling revision number with 409 naming the field", async () => {
    const { model, revision, revBody } = await freshBoard();
    await createBoardRevision(getDb(), await demoActor("engineer@tarnwell.example"), { boardModelId: model.id, ...revBody, revision: "1.1.0" });
    const put = await callRoute(revisionRoute.PUT, { url: `/api/v1/board-revisions/${revision.id}`, method: "PUT", token: engineer, params: { id: revision.id }, headers: JSON_HEADERS, body: json({ ...revBody, revision: "1.1.0" }) });
    expect(put.status).toBe(409);
    const err = (await put.json()) as { error: { message: string; issues: { path: string }[] } };
    expect(err.error.message).toMatch(/already has a revision with that number/);
    expect(err.error.issues[0]!.path).toBe("/revision");
  });
});

describe("PUT /api/v1/board-models/{id}", () => {
  it("renames a board model with an audit event; 422 on a bad prefix; 403 for a viewer", async () => {
    const { model } = await freshBoard();
    const body = { name: `${model.name} renamed`, serialPrefix: model.serialPrefix, description: "Second source" };
    const put = await callRoute(boardModelRoute.PUT, { url: `/api/v1/board-models/${model.id}`, method: "PUT", token: engineer, params: { id: model.id }, headers: JSON_HEADERS, body: json(body) });
    expect(put.status).toBe(200);
    const out = (await put.json()) as { boardModel: { name: string; revisions: unknown[] } };
    expect(out.boardModel.name).toBe(body.name);
    expect(out.boardModel.revisions).toHaveLength(1);
    const events = await auditOf("board_model.update", model.id);
    expect(events).toHaveLength(1);
    expect(events[0]!.before).toMatchObject({ name: model.name, description: "" });
    expect(events[0]!.after).toMatchObject({ name: body.name, description: "Second source" });

    const bad = await callRoute(boardModelRoute.PUT, { url: `/api/v1/board-models/${model.id}`, method: "PUT", token: engineer, params: { id: model.id }, headers: JSON_HEADERS, body: json({ ...body, serialPrefix: "lower" }) });
    expect(bad.status).toBe(422);
    const denied = await callRoute(boardModelRoute.PUT, { url: `/api/v1/board-models/${model.id}`, method: "PUT", token: viewer, params: { id: model.id }, headers: JSON_HEADERS, body: json({ ...body, name: "Viewer rename" }) });
    expect(denied.status).toBe(403);
    expect(await auditOf("board_model.update", model.id)).toHaveLength(1);
  });
});
