import { and, eq, inArray, sql } from "drizzle-orm";
import type { Database } from "../client";
import { boardModels, boardRevisions, builds, buildSlots, components, coolerModels, profiles, profileVersions, users, type BuildStage } from "../schema";
import { contentHashHex, encodeBank, satisfiesRange, validateProfile, type CoolingProfile } from "@/lib/engine";
import { toHardwareContext } from "@/lib/registry/hardware-context";
import { checkBuild } from "@/lib/release/build-check";
import { DEMO_BOARD } from "./hardware";
import { bankSignatureFields } from "../bank-signatures";
import { assertDemoEvidencePasses, demoFirmware, demoMeasurementsCsv, demoTimeline, insertDemoHistory, reached, reachedStage, storeDemoFile } from "./build-history";

/** The sound tolerance the demo evidence is checked against: the product's default (SOUND_TOLERANCE_DB). */
const DEMO_SOUND_TOLERANCE_DB = 3;

type Db = Database;

/** A small, valid demo document; invented curves shaped like a quiet or a balanced profile. */
export function demoProfileDocument(name: string, style: "balanced" | "quiet", fanMinDutyPct: number, pumpMinDutyPct: number): CoolingProfile {
  const quiet = style === "quiet";
  return {
    formatVersion: 1,
    name,
    description: quiet ? "Keeps the fans low until the liquid warms up (demo data)." : "Even trade of noise and liquid temperature (demo data).",
    criticalTempC: quiet ? 60 : 58,
    sensorLossDutyPct: 100,
    pump: {
      points: [
        { tempC: 20, dutyPct: pumpMinDutyPct },
        { tempC: 35, dutyPct: Math.max(pumpMinDutyPct, quiet ? 50 : 60) },
        { tempC: 45, dutyPct: quiet ? 70 : 80 },
        { tempC: quiet ? 55 : 50, dutyPct: 100 },
      ],
      hysteresisC: quiet ? 2 : 1,
      rampUpPctPerSec: quiet ? 5 : 15,
      rampDownPctPerSec: quiet ? 2 : 5,
    },
    fans: {
      points: [
        { tempC: quiet ? 30 : 25, dutyPct: Math.max(fanMinDutyPct, quiet ? 25 : 35) },
        { tempC: 40, dutyPct: quiet ? 40 : 55 },
        { tempC: 50, dutyPct: quiet ? 70 : 80 },
        { tempC: quiet ? 58 : 54, dutyPct: 100 },
      ],
      hysteresisC: quiet ? 1.5 : 1,
      rampUpPctPerSec: quiet ? 5 : 15,
      rampDownPctPerSec: quiet ? 2 : 5,
    },
  };
}

/**
 * Inserts a published profile version with the stored figures computed by the engine:
 * single-slot bank size and its CRC-32 trailer, canonical content hash, version parts.
 * Profile versions are immutable; this only ever inserts.
 */
export async function insertProfileVersion(db: Db, input: { profileId: string; version: string; boardRange: string; document: CoolingProfile; authorUserId: string; changelog?: string }) {
  const encoded = encodeBank([{ profile: input.document, version: input.version }]);
  if (!encoded.ok) throw new Error(`profile version does not encode: ${encoded.errors.map((e) => e.message).join("; ")}`);
  const bytes = encoded.bytes;
  const [major, minor, patch] = input.version.split(".").map(Number) as [number, number, number];
  const [row] = await db
    .insert(profileVersions)
    .values({
      profileId: input.profileId,
      version: input.version,
      versionMajor: major,
      versionMinor: minor,
      versionPatch: patch,
      boardRange: input.boardRange,
      document: input.document,
      encodedBytes: bytes.length,
      crc32: new DataView(bytes.buffer, bytes.byteOffset).getUint32(bytes.length - 4, true),
      contentHash: contentHashHex(input.document),
      changelog: input.changelog ?? "First version.",
      authorUserId: input.authorUserId,
    })
    .returning();
  return row!;
}

async function userId(db: Db, email: string): Promise<string> {
  const [u] = await db.select({ id: users.id }).from(users).where(sql`lower(${users.email}) = ${email}`);
  if (!u) throw new Error(`demo user ${email} missing`);
  return u.id;
}

/** Demo profiles for each cooler on the board, when no profile version exists for them yet. */
async function ensureProfileVersions(db: Db, boardModelId: string) {
  const coolers = await db.select().from(coolerModels).where(eq(coolerModels.boardModelId, boardModelId));
  const authorUserId = await userId(db, "engineer@tarnwell.example");
  const [smallest] = await db.select().from(boardRevisions).where(eq(boardRevisions.boardModelId, boardModelId)).orderBy(boardRevisions.memoryBytes).limit(1);
  for (const cooler of coolers) {
    const existing = await db.select({ id: profileVersions.id }).from(profileVersions).innerJoin(profiles, eq(profiles.id, profileVersions.profileId)).where(eq(profiles.coolerModelId, cooler.id)).limit(1);
    if (existing.length > 0) continue;
    const [fan] = await db.select().from(components).where(eq(components.id, cooler.fanComponentId));
    const [pump] = await db.select().from(components).where(eq(components.id, cooler.pumpComponentId));
    const hw = toHardwareContext({ cooler, fan: fan!, pump: pump!, revision: smallest! });
    for (const [name, style] of [["Factory default", "balanced"], ["Low noise", "quiet"]] as const) {
      const document = demoProfileDocument(name, style, fan!.minDutyPct, pump!.minDutyPct);
      const check = validateProfile(document, hw);
      if (!check.ok) throw new Error(`demo profile ${name} for ${cooler.name} is not valid: ${check.issues.map((i) => i.message).join("; ")}`);
      await db.insert(profiles).values({ coolerModelId: cooler.id, name, description: document.description ?? "", ownerUserId: authorUserId }).onConflictDoNothing();
      const [profile] = await db.select().from(profiles).where(and(eq(profiles.coolerModelId, cooler.id), eq(profiles.name, name)));
      await insertProfileVersion(db, { profileId: profile!.id, version: "1.0.0", boardRange: ">=1.0.0", document, authorUserId });
    }
  }
}

/** A minimal one-page PDF with a line of text (PDF 1.4 structure, offsets computed). */
export function tinyPdf(text: string): Buffer {
  const objects = [
    "<< /Type /Catalog /Pages 2 0 R >>",
    "<< /Type /Pages /Kids [3 0 R] /Count 1 >>",
    "<< /Type /Page /Parent 2 0 R /MediaBox [0 0 595 842] /Contents 4 0 R /Resources << /Font << /F1 5 0 R >> >> >>",
    `<< /Length ${`BT /F1 14 Tf 72 770 Td (${text}) Tj ET`.length} >>\nstream\nBT /F1 14 Tf 72 770 Td (${text}) Tj ET\nendstream`,
    "<< /Type /Font /Subtype /Type1 /BaseFont /Helvetica >>",
  ];
  let out = "%PDF-1.4\n";
  const offsets: number[] = [];
  objects.forEach((o, i) => {
    offsets.push(out.length);
    out += `${i + 1} 0 obj\n${o}\nendobj\n`;
  });
  const xref = out.length;
  out += `xref\n0 ${objects.length + 1}\n0000000000 65535 f \n${offsets.map((o) => `${String(o).padStart(10, "0")} 00000 n \n`).join("")}`;
  out += `trailer\n<< /Size ${objects.length + 1} /Root 1 0 R >>\nstartxref\n${xref}\n%%EOF\n`;
  return Buffer.from(out, "latin1");
}

interface DemoBuild {
  version: string;
  stage: BuildStage;
  range: string;
  cooler: string;
  /** When the build was created; its history follows on the demo's timeline. */
  createdOn: string;
  withdrawn?: { from: BuildStage; on: string; reason: string };
  releaseNotes?: string;
}

const DEMO_BUILDS: DemoBuild[] = [
  { version: "1.0.0", stage: "production", range: ">=1.0.0 <3.0.0", cooler: "Tarn 240", createdOn: "2025-05-05", releaseNotes: "First factory release for the Tarn 240." },
  {
    version: "1.0.1",
    stage: "withdrawn",
    range: ">=1.0.0 <3.0.0",
    cooler: "Tarn 360",
    createdOn: "2025-06-02",
    withdrawn: { from: "pilot", on: "2025-06-20", reason: "Pump ramp too slow on cold start in the pilot run; replaced by 1.1.0." },
  },
  { version: "1.1.0", stage: "pilot", range: ">=1.1.0 <3.0.0", cooler: "Tarn 360", createdOn: "2025-07-07" },
  { version: "1.2.0", stage: "validation", range: ">=1.1.0 <3.0.0", cooler: "Tarn 240", createdOn: "2025-08-04" },
  { version: "1.3.0", stage: "review", range: "^2.0.0", cooler: "Tarn 360", createdOn: "2025-09-01" },
  { version: "1.4.0", stage: "draft", range: "^2.0.0", cooler: "Tarn 240", createdOn: "2025-09-15" },
];

/** Builds of the demo board at every stage, with real bank images, and the reviews, evidence and timelines their gates ask for. */
export async function seedBuilds(db: Db) {
  const [board] = await db.select().from(boardModels).where(eq(boardModels.name, DEMO_BOARD.name));
  if (!board) throw new Error("demo board missing");
  await ensureProfileVersions(db, board.id);
  const engineer = await userId(db, "engineer@tarnwell.example");
  // Reviewers are picked per build among those who wrote none of it, so their approvals count.
  const reviewerPool = [await userId(db, "engineer2@tarnwell.example"), await userId(db, "engineer3@tarnwell.example"), await userId(db, "admin@tarnwell.example")];
  const release = await userId(db, "release@tarnwell.example");
  const revisions = await db.select().from(boardRevisions).where(eq(boardRevisions.boardModelId, board.id));

  for (const demo of DEMO_BUILDS) {
    const [exists] = await db.select({ id: builds.id }).from(builds).where(and(eq(builds.boardModelId, board.id), eq(builds.version, demo.version)));
    if (exists) continue;
    const [cooler] = await db.select().from(coolerModels).where(eq(coolerModels.name, demo.cooler));
    if (!cooler) continue;
    const versions = await db
      .select({ pv: profileVersions, profileName: profiles.name })
      .from(profileVersions)
      .innerJoin(profiles, eq(profiles.id, profileVersions.profileId))
      .where(eq(profiles.coolerModelId, cooler.id))
      .orderBy(profiles.name)
      .limit(2);
    if (versions.length === 0) continue;
    const [fan] = await db.select().from(components).where(eq(components.id, cooler.fanComponentId));
    const [pump] = await db.select().from(components).where(eq(components.id, cooler.pumpComponentId));
    const check = checkBuild({
      revisionRange: demo.range,
      revisions,
      slots: versions.map((v) => ({ label: `${v.profileName} ${v.pv.version}`, document: v.pv.document, version: v.pv.version, boardRange: v.pv.boardRange, contentHash: v.pv.contentHash, cooler, fan: fan!, pump: pump! })),
    });
    if (!check.ok) throw new Error(`demo build ${demo.version} does not check: ${check.issues.join("; ")}`);
    const authors = new Set([engineer, ...versions.map((v) => v.pv.authorUserId)]);
    const [first, second] = reviewerPool.filter((id) => !authors.has(id));
    if (!first || !second) throw new Error(`demo build ${demo.version} has no two reviewers who wrote none of it`);
    const reviewers = [first, second] as const;
    const timeline = demoTimeline(new Date(`${demo.createdOn}T09:00:00Z`));
    const top = reachedStage(demo.stage, demo.withdrawn?.from);
    await db.transaction(async (tx) => {
      const firmwareUploadId = await storeDemoFile(tx, { kind: "firmware", name: `tc1-fw-${demo.version}.bin`, contentType: "application/octet-stream", bytes: demoFirmware(demo.version), uploadedByUserId: engineer, createdAt: timeline.createdAt });
      let labReportUploadId: string | null = null;
      let measurementsUploadId: string | null = null;
      if (reached(top, "pilot")) {
        // The gate compares with the estimate at the first slot's cooler and the first revision in range, as here.
        const inRange = revisions.filter((r) => satisfiesRange(r.revision, demo.range));
        const hw = toHardwareContext({ cooler, fan: fan!, pump: pump!, revision: inRange[0] ?? revisions[0]! });
        const csv = demoMeasurementsCsv(hw, fan!.maxRpm);
        assertDemoEvidencePasses(demo.version, csv, hw, DEMO_SOUND_TOLERANCE_DB);
        const evidence = { uploadedByUserId: release, createdAt: timeline.labEvidence };
        labReportUploadId = await storeDemoFile(tx, { kind: "lab_report", name: `lab-report-${demo.version}.pdf`, contentType: "application/pdf", bytes: tinyPdf(`Tarnwell lab report, build ${demo.version} (demo)`), ...evidence });
        measurementsUploadId = await storeDemoFile(tx, { kind: "measurements", name: `measurements-${demo.version}.csv`, contentType: "text/csv", bytes: Buffer.from(csv), ...evidence });
      }
      // Builds that reached pilot carry the bank signature made at that move.
      const signature = reached(top, "pilot") ? await bankSignatureFields(tx, { boardModelId: board.id, bankImage: check.image }) : {};
      const last = demo.withdrawn ? new Date(`${demo.withdrawn.on}T15:00:00Z`) : top === "draft" ? timeline.createdAt : timeline[top as "review" | "validation" | "pilot" | "production"];
      const [b] = await tx
        .insert(builds)
        .values({
          boardModelId: board.id,
          version: demo.version,
          revisionRange: demo.range,
          stage: demo.stage,
          authorUserId: engineer,
          firmwareUploadId,
          labReportUploadId,
          measurementsUploadId,
          bankImage: check.image,
          bankBytes: check.bankBytes,
          bankSha256: check.sha256,
          bankCrc32: check.crc32,
          releaseNotes: demo.releaseNotes ?? null,
          withdrawnReason: demo.withdrawn?.reason ?? null,
          createdAt: timeline.createdAt,
          updatedAt: last,
          ...signature,
        })
        .returning({ id: builds.id });
      const buildId = b!.id;
      await tx.insert(buildSlots).values(versions.map((v, slotIndex) => ({ buildId, slotIndex, profileVersionId: v.pv.id })));
      await insertDemoHistory(tx, {
        buildId,
        stage: demo.stage,
        timeline,
        askedByUserId: engineer,
        releaseUserId: release,
        reviewers,
        releaseNotes: demo.releaseNotes ?? null,
        withdrawn: demo.withdrawn ? { from: demo.withdrawn.from, at: new Date(`${demo.withdrawn.on}T15:00:00Z`), reason: demo.withdrawn.reason } : null,
      });
    });
  }
  return db.select({ id: builds.id, stage: builds.stage }).from(builds).where(inArray(builds.boardModelId, [board.id]));
}
