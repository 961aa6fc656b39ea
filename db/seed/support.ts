import { and, eq, sql } from "drizzle-orm";
import type { Database } from "../client";
import { boardModels, boardRevisions, buildSlots, builds, components, coolerModels, productionLots, profileVersions, profiles, users, type Build, type ProfileVersion } from "../schema";
import { bankSignatureFields } from "../bank-signatures";
import { contentHashHex, crc32, encodeBank, sha256, toHex, type CoolingProfile } from "@/lib/engine";
import { satisfiesRange, compareVersions } from "@/lib/versioning/semver-helpers";
import { DEMO_BOARD } from "./hardware";
import { toHardwareContext } from "@/lib/registry/hardware-context";
import { assertDemoEvidencePasses, demoFirmware, demoMeasurementsCsv, demoTimeline, insertDemoHistory, storeDemoFile } from "./build-history";
import { tinyPdf } from "./builds";

/**
 * Support's demo data: a few published profile versions and builds (only where the
 * registry and build seeds have not made them: looked up by natural keys first) and
 * production lots with tens of thousands of serials, one of them on the withdrawn build.
 * Invented data.
 */

type Doc = CoolingProfile;

const quiet = (pump45: number, fan50: number): Doc => ({
  formatVersion: 1,
  name: "Quiet",
  description: "Low noise for everyday use; fans stop while the liquid is cool.",
  criticalTempC: 60,
  sensorLossDutyPct: 100,
  pump: { points: [{ tempC: 20, dutyPct: 40 }, { tempC: 35, dutyPct: 50 }, { tempC: 45, dutyPct: pump45 }, { tempC: 55, dutyPct: 100 }], hysteresisC: 2, rampUpPctPerSec: 5, rampDownPctPerSec: 2 },
  fans: { points: [{ tempC: 30, dutyPct: 25 }, { tempC: 40, dutyPct: 40 }, { tempC: 50, dutyPct: fan50 }, { tempC: 58, dutyPct: 100 }], hysteresisC: 1.5, rampUpPctPerSec: 5, rampDownPctPerSec: 2, stopBelowTempC: 30 },
});

const performance = (hysteresisC: number): Doc => ({
  formatVersion: 1,
  name: "Performance",
  description: "Keeps the liquid cool under sustained load at the cost of noise.",
  criticalTempC: 58,
  sensorLossDutyPct: 100,
  pump: { points: [{ tempC: 20, dutyPct: 60 }, { tempC: 40, dutyPct: 80 }, { tempC: 50, dutyPct: 100 }], hysteresisC: 1, rampUpPctPerSec: 20, rampDownPctPerSec: 5 },
  fans: { points: [{ tempC: 20, dutyPct: 35 }, { tempC: 35, dutyPct: 55 }, { tempC: 45, dutyPct: 80 }, { tempC: 52, dutyPct: 100 }], hysteresisC, rampUpPctPerSec: 20, rampDownPctPerSec: 5 },
});

const DEMO_VERSIONS: { profile: string; version: string; doc: Doc; changelog: string }[] = [
  { profile: "Quiet", version: "1.0.0", doc: quiet(70, 70), changelog: "First release." },
  { profile: "Quiet", version: "1.1.0", doc: quiet(60, 60), changelog: "Quieter pump and fans at 45–50 °C." },
  { profile: "Quiet", version: "1.2.0", doc: quiet(75, 75), changelog: "Restores cooling at 45–50 °C after field reports of hot liquid." },
  { profile: "Performance", version: "1.0.0", doc: performance(1), changelog: "First release." },
  { profile: "Performance", version: "1.1.0", doc: performance(2), changelog: "Wider fan hysteresis against hunting." },
];

const DEMO_BUILDS = [
  { version: "3.0.0", stage: "production" as const, createdOn: "2024-10-07", revisionRange: ">=1.1.0 <2.0.0", slots: [["Quiet", "1.0.0"], ["Performance", "1.0.0"]], withdrawn: null },
  {
    version: "3.0.1",
    stage: "withdrawn" as const,
    createdOn: "2024-12-02",
    revisionRange: ">=1.1.0 <2.0.0",
    slots: [["Quiet", "1.1.0"], ["Performance", "1.0.0"]],
    // Released, shipped in lot TW-2502, then withdrawn after field reports.
    withdrawn: { from: "production" as const, on: "2025-02-24", reason: "Quiet 1.1.0 lets the liquid reach 52 °C at 250 W; replace with build 3.1.0." },
  },
  { version: "3.1.0", stage: "production" as const, createdOn: "2025-01-20", revisionRange: ">=1.1.0 <2.0.0", slots: [["Quiet", "1.2.0"], ["Performance", "1.1.0"]], withdrawn: null },
  { version: "3.2.0", stage: "production" as const, createdOn: "2025-02-17", revisionRange: ">=2.0.0 <3.0.0", slots: [["Quiet", "1.2.0"], ["Performance", "1.1.0"]], withdrawn: null },
];

const DEMO_LOTS = [
  { lotCode: "TW-2501", build: "3.0.0", from: 10_000, to: 29_999, producedOn: "2025-01-14", line: "Line A" },
  { lotCode: "TW-2502", build: "3.0.1", from: 30_000, to: 44_999, producedOn: "2025-02-11", line: "Line A" },
  { lotCode: "TW-2503", build: "3.1.0", from: 45_000, to: 69_999, producedOn: "2025-03-04", line: "Line B" },
  { lotCode: "TW-2504", build: "3.2.0", from: 70_000, to: 79_999, producedOn: "2025-03-25", line: "Line B" },
];

/** Bank image of one slot; its length and CRC are what a profile version records. */
function singleSlotBank(doc: Doc, version: string, hash: string) {
  const r = encodeBank([{ profile: doc, version, contentHashHex: hash }]);
  if (!r.ok) throw new Error(`demo profile ${doc.name} ${version} does not encode: ${r.errors.map((e) => e.message).join("; ")}`);
  return r.bytes;
}

async function ensureVersions(db: Database, coolerId: string, ownerId: string): Promise<Map<string, ProfileVersion>> {
  const out = new Map<string, ProfileVersion>();
  for (const v of DEMO_VERSIONS) {
    await db.insert(profiles).values({ coolerModelId: coolerId, name: v.profile, description: v.doc.description ?? "", ownerUserId: ownerId }).onConflictDoNothing();
    const [profile] = await db.select().from(profiles).where(and(eq(profiles.coolerModelId, coolerId), eq(profiles.name, v.profile)));
    if (!profile) throw new Error(`profile ${v.profile} missing`);
    const hash = contentHashHex(v.doc);
    const bytes = singleSlotBank(v.doc, v.version, hash);
    const [major, minor, patch] = v.version.split(".").map(Number) as [number, number, number];
    await db
      .insert(profileVersions)
      .values({
        profileId: profile.id,
        version: v.version,
        versionMajor: major,
        versionMinor: minor,
        versionPatch: patch,
        boardRange: ">=1.0.0",
        document: v.doc,
        encodedBytes: bytes.length,
        crc32: crc32(bytes, 0, 0, bytes.length - 4),
        contentHash: hash,
        changelog: v.changelog,
        authorUserId: ownerId,
      })
      .onConflictDoNothing();
    const [row] = await db.select().from(profileVersions).where(and(eq(profileVersions.profileId, profile.id), eq(profileVersions.version, v.version)));
    if (row) out.set(`${v.profile}@${v.version}`, row);
  }
  return out;
}

export async function seedSupport(db: Database) {
  const [board] = await db.select().from(boardModels).where(eq(boardModels.name, DEMO_BOARD.name));
  const [cooler] = await db.select().from(coolerModels).where(eq(coolerModels.name, "Tarn 240"));
  const [owner] = await db.select().from(users).where(sql`lower(${users.email}) = 'engineer@tarnwell.example'`);
  const [releaser] = await db.select().from(users).where(sql`lower(${users.email}) = 'release@tarnwell.example'`);
  const [reviewer1] = await db.select().from(users).where(sql`lower(${users.email}) = 'engineer2@tarnwell.example'`);
  const [reviewer2] = await db.select().from(users).where(sql`lower(${users.email}) = 'engineer3@tarnwell.example'`);
  if (!board || !cooler || !owner || !releaser || !reviewer1 || !reviewer2) throw new Error("support seed needs the demo board, cooler and users");
  // They wrote neither these builds nor their profile versions, so their approvals count.
  const reviewers = [reviewer1.id, reviewer2.id] as const;
  const revisions = (await db.select().from(boardRevisions).where(eq(boardRevisions.boardModelId, board.id))).sort((a, b) => compareVersions(a.revision, b.revision));

  const byBuild = new Map<string, Build>();
  let versions: Map<string, ProfileVersion> | undefined;
  for (const b of DEMO_BUILDS) {
    const [existing] = await db.select().from(builds).where(and(eq(builds.boardModelId, board.id), eq(builds.version, b.version)));
    if (existing) {
      byBuild.set(b.version, existing);
      continue;
    }
    versions ??= await ensureVersions(db, cooler.id, owner.id);
    const slotVersions = b.slots.map(([p, v]) => versions!.get(`${p}@${v}`));
    if (slotVersions.some((v) => !v)) continue;
    // The smallest revision in range bounds the image: it must fit every board the build is for.
    const smallest = revisions.filter((r) => satisfiesRange(r.revision, b.revisionRange)).sort((x, y) => x.memoryBytes - y.memoryBytes)[0];
    const bank = encodeBank(
      slotVersions.map((v) => ({ profile: v!.document as Doc, version: v!.version, contentHashHex: v!.contentHash })),
      smallest ? { memoryBytes: smallest.memoryBytes, slotCount: smallest.slotCount } : {},
    );
    if (!bank.ok) throw new Error(`demo build ${b.version} does not encode: ${bank.errors.map((e) => e.message).join("; ")}`);
    const image = bank.bytes;
    const timeline = demoTimeline(new Date(`${b.createdOn}T09:00:00Z`));
    const withdrawnAt = b.withdrawn ? new Date(`${b.withdrawn.on}T15:00:00Z`) : null;
    const created = await db.transaction(async (tx) => {
      // Every demo build here reached the factory: firmware, lab evidence that passes the pilot gate, and a signed bank.
      // The profiles are the Tarn 240's, so the gate compares with its estimate.
      const [fan] = await tx.select().from(components).where(eq(components.id, cooler.fanComponentId));
      const [pump] = await tx.select().from(components).where(eq(components.id, cooler.pumpComponentId));
      const inRange = revisions.filter((r) => satisfiesRange(r.revision, b.revisionRange));
      const hw = toHardwareContext({ cooler, fan: fan!, pump: pump!, revision: inRange[0]! });
      const csv = demoMeasurementsCsv(hw, fan!.maxRpm);
      assertDemoEvidencePasses(b.version, csv, hw, 3);
      const evidence = { uploadedByUserId: releaser.id, createdAt: timeline.labEvidence };
      const firmwareUploadId = await storeDemoFile(tx, { kind: "firmware", name: `tc1-fw-${b.version}.bin`, contentType: "application/octet-stream", bytes: demoFirmware(b.version), uploadedByUserId: releaser.id, createdAt: timeline.createdAt });
      const labReportUploadId = await storeDemoFile(tx, { kind: "lab_report", name: `lab-report-${b.version}.pdf`, contentType: "application/pdf", bytes: tinyPdf(`Tarnwell lab report, build ${b.version} (demo)`), ...evidence });
      const measurementsUploadId = await storeDemoFile(tx, { kind: "measurements", name: `measurements-${b.version}.csv`, contentType: "text/csv", bytes: Buffer.from(csv), ...evidence });
      const signature = await bankSignatureFields(tx, { boardModelId: board.id, bankImage: image });
      const [row] = await tx
        .insert(builds)
        .values({
          boardModelId: board.id,
          version: b.version,
          revisionRange: b.revisionRange,
          // A withdrawn build is written as it was when signed (pilot or later) and withdrawn after:
          // the database refuses any change to a withdrawn build, the signature included.
          stage: b.stage,
          authorUserId: releaser.id,
          bankImage: image,
          bankBytes: image.length,
          bankSha256: toHex(sha256(image)),
          bankCrc32: new DataView(image.buffer, image.byteOffset).getUint32(image.length - 4, true),
          releaseNotes: `Demo build ${b.version}.`,
          withdrawnReason: b.withdrawn?.reason ?? null,
          firmwareUploadId,
          labReportUploadId,
          measurementsUploadId,
          createdAt: timeline.createdAt,
          updatedAt: withdrawnAt ?? timeline.production,
          ...signature,
        })
        .onConflictDoNothing()
        .returning();
      if (row) {
        await tx.insert(buildSlots).values(slotVersions.map((v, i) => ({ buildId: row.id, slotIndex: i, profileVersionId: v!.id })));
        await insertDemoHistory(tx, {
          buildId: row.id,
          stage: b.stage,
          timeline,
          askedByUserId: releaser.id,
          releaseUserId: releaser.id,
          reviewers,
          releaseNotes: `Demo build ${b.version}.`,
          withdrawn: b.withdrawn && withdrawnAt ? { from: b.withdrawn.from, at: withdrawnAt, reason: b.withdrawn.reason } : null,
        });
      }
      return row;
    });
    if (created) byBuild.set(b.version, created);
  }

  for (const lot of DEMO_LOTS) {
    const build = byBuild.get(lot.build);
    if (!build) continue;
    // The newest demo revision the build is for, so lots match whichever seed made the build.
    const revision = [...revisions].reverse().find((r) => satisfiesRange(r.revision, build.revisionRange));
    if (!revision) continue;
    await db.transaction(async (tx) => {
      // These lots were produced while their build was released; one build was withdrawn since.
      if (build.stage === "withdrawn") await tx.execute(sql`set local loopkeeper.historic_lot = 'on'`);
      await tx
        .insert(productionLots)
        .values({ lotCode: lot.lotCode, boardModelId: board.id, boardRevisionId: revision.id, buildId: build.id, serialFrom: lot.from, serialTo: lot.to, producedOn: lot.producedOn, line: lot.line })
        .onConflictDoNothing();
    });
  }
}
