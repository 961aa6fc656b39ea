import { afterAll, describe, expect, it } from "vitest";
import { and, eq, sql } from "drizzle-orm";
import { closeDb, demoActor, getDb } from "./support/db";
import { createLot } from "@/lib/use-cases/lots/create";
import { importLots } from "@/lib/use-cases/lots/import";
import { findLotBySerial } from "@/db/lookup";
import { boardModels, builds, productionLots } from "@/db/schema";
import { parseLotsCsv } from "@/lib/lots/csv";
import { lookupSerial } from "@/lib/use-cases/support/lookup";

afterAll(closeDb);

const HEADER = "lot_code,board_revision,build_version,serial_from,serial_to,produced_on,line";
const stamp = Date.now() % 10_000;

async function demoIds() {
  const db = getDb();
  const [board] = await db.select().from(boardModels).where(eq(boardModels.serialPrefix, "TC1"));
  const [lot] = await db.select().from(productionLots).where(eq(productionLots.lotCode, "TW-2501"));
  const [withdrawn] = await db.select().from(builds).where(and(eq(builds.boardModelId, board!.id), eq(builds.version, "3.0.1")));
  return { board: board!, lot: lot!, withdrawn: withdrawn! };
}

describe("production lots", () => {
  it("PostgreSQL refuses an overlapping lot, and the app names the lot in the way", async () => {
    const db = getDb();
    const { lot } = await demoIds();
    await expect(
      db.insert(productionLots).values({ ...lot, id: undefined, lotCode: `X-${stamp}`, serialFrom: lot.serialTo, serialTo: lot.serialTo + 5, createdAt: undefined }),
    ).rejects.toMatchObject({ cause: { code: "23P01", constraint: "production_lots_no_overlap" } });
    const release = await demoActor("release@tarnwell.example");
    await expect(
      createLot(db, release, { lotCode: `X-${stamp}`, boardRevision: "1.1.0", buildVersion: "3.0.0", serialFrom: "TC1-00029990", serialTo: "TC1-00030005", producedOn: "2025-04-01", line: "Line A" }),
    ).rejects.toThrow(/overlap lot TW-2501 \(TC1-00010000 to TC1-00029999\)/);
  });

  it("refuses a lot on a withdrawn build, in the app and in the database", async () => {
    const db = getDb();
    const release = await demoActor("release@tarnwell.example");
    const { lot, withdrawn } = await demoIds();
    await expect(
      createLot(db, release, { lotCode: `W-${stamp}`, boardRevision: "1.1.0", buildVersion: "3.0.1", serialFrom: "TC1-90000000", serialTo: "TC1-90000010", producedOn: "2025-04-01", line: "Line A" }),
    ).rejects.toThrow(/stage "withdrawn"; lots may only name builds at pilot or production/);
    await expect(
      db.insert(productionLots).values({ ...lot, id: undefined, lotCode: `W-${stamp}`, buildId: withdrawn.id, serialFrom: 90_000_000, serialTo: 90_000_010, createdAt: undefined }),
    ).rejects.toMatchObject({ cause: { code: "23514" } });
  });

  it("refuses a board revision outside the build's revision range", async () => {
    const release = await demoActor("release@tarnwell.example");
    await expect(
      createLot(getDb(), release, { lotCode: `R-${stamp}`, boardRevision: "2.0.0", buildVersion: "3.0.0", serialFrom: "TC1-91000000", serialTo: "TC1-91000010", producedOn: "2025-04-01", line: "Line A" }),
    ).rejects.toThrow(/revision 2.0.0 is outside it/);
  });

  it("records a good lot with its audit event", async () => {
    const db = getDb();
    const release = await demoActor("release@tarnwell.example");
    const from = 92_000_000 + stamp * 10;
    const { lot } = await createLot(db, release, { lotCode: `G-${stamp}`, boardRevision: "1.1.0", buildVersion: "3.1.0", serialFrom: `TC1-${from}`, serialTo: `TC1-${from + 9}`, producedOn: "2025-04-01", line: "Line C" });
    const audit = await db.execute(sql`select action from audit_events where entity_id = ${lot.id}`);
    expect(audit.rows).toEqual([{ action: "lot.create" }]);
  });

  it("a CSV with one bad row commits nothing and names the row", async () => {
    const db = getDb();
    const release = await demoActor("release@tarnwell.example");
    const base = 93_000_000 + stamp * 100;
    const csv = [
      HEADER,
      `C1-${stamp},1.1.0,3.1.0,TC1-${base},TC1-${base + 9},2025-04-02,Line A`,
      `C2-${stamp},1.1.0,3.0.1,TC1-${base + 10},TC1-${base + 19},2025-04-02,Line A`,
      `C3-${stamp},1.1.0,3.1.0,TC1-${base + 20},TC1-${base + 29},2025-04-02,Line A`,
    ].join("\n");
    const parsed = parseLotsCsv(csv);
    expect(parsed.issues).toEqual([]);
    const preview = await importLots(db, release, { rows: parsed.rows, dryRun: true });
    expect(preview.issues).toEqual([{ row: 3, column: "build_version", message: expect.stringMatching(/stage "withdrawn"/) as string }]);
    const commit = await importLots(db, release, { rows: parsed.rows, dryRun: false });
    expect(commit.committed).toBe(0);
    expect(commit.issues.map((i) => i.row)).toEqual([3]);
    const written = await db.execute(sql`select count(*)::int as n from production_lots where lot_code like ${`C_-${stamp}`}`);
    expect(written.rows[0]).toEqual({ n: 0 });
    // Without the bad row the same file commits in one go.
    const good = await importLots(db, release, { rows: parsed.rows.filter((r) => r.row !== 3), dryRun: false });
    expect(good).toMatchObject({ committed: 2, issues: [] });
  });
});

describe("serial lookup", () => {
  it("finds the lot at both ends of its range and nothing in a gap", async () => {
    const db = getDb();
    expect((await findLotBySerial(db, { prefix: "TC1", serialNumber: 10_000 }))?.lot.lotCode).toBe("TW-2501");
    expect((await findLotBySerial(db, { prefix: "TC1", serialNumber: 29_999 }))?.lot.lotCode).toBe("TW-2501");
    expect(await findLotBySerial(db, { prefix: "TC1", serialNumber: 9_999 })).toBeUndefined();
    expect(await findLotBySerial(db, { prefix: "TC1", serialNumber: 80_000 })).toBeUndefined();
    expect(await findLotBySerial(db, { prefix: "ZZ9", serialNumber: 10_000 })).toBeUndefined();
  });

  it("shows the withdrawn build with its reason and the newer production build's changes", async () => {
    const r = await lookupSerial(getDb(), { prefix: "TC1", number: 30_500 });
    expect(r?.build).toMatchObject({ version: "3.0.1", stage: "withdrawn" });
    expect(r?.build.withdrawnReason).toBeTruthy();
    // Other suites may add production builds to the shared test database; the demo's 3.1.0 must be among them,
    // and nothing older than the withdrawn 3.0.1 may be offered as newer.
    const versions = r?.newerBuilds.map((b) => b.version) ?? [];
    expect(versions).toContain("3.1.0");
    expect(versions).not.toContain("3.0.0");
    const quiet = r?.newerBuilds.find((b) => b.version === "3.1.0")?.changes.find((c) => c.profileName === "Quiet");
    expect(quiet).toMatchObject({ fromVersion: "1.1.0", toVersion: "1.2.0", kind: "changed" });
    expect(quiet?.changes).toContain("pump: 45 °C 60 % → 75 %");
    expect(r?.pump.pulsesPerRev).toBe(4);
  });
});
