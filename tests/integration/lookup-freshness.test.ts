import { randomBytes, randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { eq, sql } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "./support/db";
import { callRoute, tokenFor } from "./support/http";
import { demoBoardId, mover, uniqueVersion } from "./support/builds";
import { builds, components, coolerModels, profiles, uploads, type Component } from "@/db/schema";
import { demoProfileDocument, insertProfileVersion } from "@/db/seed/builds";
import { createBuild } from "@/lib/use-cases/builds/create";
import { moveBuild } from "@/lib/use-cases/builds/stages";
import { createLot } from "@/lib/use-cases/lots/create";
import { createComponent, updateComponent } from "@/lib/use-cases/registry/save-component";
import { createCoolerModel } from "@/lib/use-cases/registry/save-cooler-model";
import { GET as lookup } from "@/app/api/v1/lookup/route";
import type { LookupResult } from "@/lib/api/operations/support";

afterAll(closeDb);

// The lookup keeps a build's slots in process by build id; these are the changes that must
// still show on the very next lookup in the same process: a lot recorded, a build withdrawn,
// a pump's figures edited in the registry.

/** A production build of the demo board with one slot on a cooler of its own (fan and pump of its own too). */
async function productionBuildOfItsOwn() {
  const db = getDb();
  const engineer = await demoActor("engineer@tarnwell.example");
  const admin = await demoActor("admin@tarnwell.example");
  const boardModelId = await demoBoardId();
  const [tarn] = await db.select().from(coolerModels).where(eq(coolerModels.name, "Tarn 240"));
  const [demoFan] = await db.select().from(components).where(eq(components.id, tarn!.fanComponentId));
  const [demoPump] = await db.select().from(components).where(eq(components.id, tarn!.pumpComponentId));
  const tag = randomUUID().slice(0, 8);
  const copy = ({ id: _id, createdAt: _c, updatedAt: _u, ...fields }: Component, name: string) => ({ ...fields, name });
  const fan = await createComponent(db, admin, copy(demoFan!, `Freshness fan ${tag}`));
  const pump = await createComponent(db, admin, copy(demoPump!, `Freshness pump ${tag}`));
  const cooler = await createCoolerModel(db, admin, {
    name: `Freshness 240 ${tag}`,
    radiatorMm: tarn!.radiatorMm,
    fanComponentId: fan.id,
    fanCount: tarn!.fanCount,
    pumpComponentId: pump.id,
    boardModelId,
    radiatorKPerWAtMinFan: tarn!.radiatorKPerWAtMinFan,
    radiatorKPerWAtMaxFan: tarn!.radiatorKPerWAtMaxFan,
  });
  const [profile] = await db.insert(profiles).values({ coolerModelId: cooler.id, name: `Freshness ${tag}`, ownerUserId: engineer.userId }).returning();
  const version = await insertProfileVersion(db, {
    profileId: profile!.id,
    version: "1.0.0",
    boardRange: ">=1.0.0",
    document: demoProfileDocument(profile!.name, "balanced", fan.minDutyPct, pump.minDutyPct),
    authorUserId: engineer.userId,
  });
  const [fw] = await db
    .insert(uploads)
    .values({ kind: "firmware", storageKey: randomUUID(), originalName: "fw.bin", contentType: "application/octet-stream", sizeBytes: 1, sha256: "0".repeat(64), uploadedByUserId: engineer.userId })
    .returning();
  const { build } = await createBuild(db, engineer, { boardModelId, version: uniqueVersion(), revisionRange: ">=1.0.0 <2.0.0", firmwareUploadId: fw!.id, slots: [version.id] });
  // The release path's gates are tested elsewhere; here only the stage matters.
  await db.update(builds).set({ stage: "production" }).where(eq(builds.id, build.id));
  return { build, pump, profileName: profile!.name };
}

describe("serial lookup answers from fresh lots and stages, with the build's slots kept in process", () => {
  let token: string;
  let fixture: Awaited<ReturnType<typeof productionBuildOfItsOwn>>;
  // Eight digits, far above the demo's lots and other files' ranges, different on every run.
  const serialFrom = 95_000_000 + (randomBytes(3).readUIntBE(0, 3) % 40_000) * 100;
  const serial = `TC1-${serialFrom + 42}`;
  const get = async () => {
    const res = await callRoute(lookup, { url: `/api/v1/lookup?serial=${serial}`, token });
    return { status: res.status, body: (await res.json()) as LookupResult };
  };

  beforeAll(async () => {
    token = await tokenFor("support@tarnwell.example");
    fixture = await productionBuildOfItsOwn();
  });

  it("a serial no lot covers is not found, and is found on the next lookup once its lot is recorded", async () => {
    expect((await get()).status).toBe(404);
    const release = await demoActor("release@tarnwell.example");
    await createLot(getDb(), release, {
      lotCode: `FR-${serialFrom}`,
      boardRevision: "1.1.0",
      buildVersion: fixture.build.version,
      serialFrom: `TC1-${serialFrom}`,
      serialTo: `TC1-${serialFrom + 99}`,
      producedOn: "2025-05-01",
      line: "Line A",
    });
    const found = await get();
    expect(found.status).toBe(200);
    expect(found.body.lot.lotCode).toBe(`FR-${serialFrom}`);
    expect(found.body.build).toMatchObject({ id: fixture.build.id, stage: "production", withdrawnReason: null });
    expect(found.body.slots.map((s) => [s.profileName, s.pump.name])).toEqual([[fixture.profileName, fixture.pump.name]]);
  });

  it("an edit of the slot's pump shows on the next lookup", async () => {
    // Warm: the build's slots are in memory now.
    expect((await get()).body.slots[0]?.pump.maxRpm).toBe(fixture.pump.maxRpm);
    const admin = await demoActor("admin@tarnwell.example");
    const { id: _id, createdAt: _c, updatedAt: _u, ...fields } = fixture.pump;
    await updateComponent(getDb(), admin, { id: fixture.pump.id, ...fields, maxRpm: fixture.pump.maxRpm + 100 });
    const after = await get();
    expect(after.body.slots[0]?.pump.maxRpm).toBe(fixture.pump.maxRpm + 100);
  });

  it("a withdrawn build says so on the next lookup, with its reason", async () => {
    expect((await get()).body.build.stage).toBe("production");
    const reason = `Pump stalls at low duty (${randomUUID().slice(0, 6)})`;
    await moveBuild(await mover("release@tarnwell.example"), { id: fixture.build.id, from: "production", to: "withdrawn", reason });
    const after = await get();
    expect(after.status).toBe(200);
    expect(after.body.build).toMatchObject({ id: fixture.build.id, stage: "withdrawn", withdrawnReason: reason });
    // The same slots as before the withdrawal: they are the build's, whatever its stage.
    expect(after.body.slots.map((s) => s.profileName)).toEqual([fixture.profileName]);
    const stage = await getDb().execute(sql`select stage from builds where id = ${fixture.build.id}`);
    expect(stage.rows).toEqual([{ stage: "withdrawn" }]);
  });
});
