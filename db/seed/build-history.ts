import { createHash, randomUUID } from "node:crypto";
import fs from "node:fs";
import path from "node:path";
import type { Executor } from "../client";
import { buildReviews, buildTransitions, uploads, type BuildStage } from "../schema";
import { coolerNoise, type HardwareContext } from "@/lib/engine";
import { gateIssues, pilotGate } from "@/lib/release/gates";
import { PROMOTION_PATH } from "@/lib/release/transitions";
import { compareMeasurements, MEASUREMENT_HEADER_WITH_BACKGROUND, parseMeasurementsCsv, soundGateIssues, soundGateSummary } from "@/lib/release/measurements";

/**
 * The demo's release history, made so that every seeded build past review passes the gates
 * a real build would have to pass: approvals from people who wrote none of it, firmware, a
 * lab report, in-tolerance measurements taken in a room with a stated background, and a
 * timeline in calendar order. Invented data.
 */

const DAY_MS = 86_400_000;
const PATH: readonly BuildStage[] = PROMOTION_PATH;

/** Days after creation at which each step happens (a plausible pace for a small maker). */
const DAYS_AFTER_CREATION = { review: 1, firstApproval: 2, secondApproval: 3, validation: 4, labEvidence: 10, pilot: 12, production: 20 } as const;

/** The dates of a demo build's history, from its creation date. */
export function demoTimeline(createdAt: Date) {
  const at = (days: number) => new Date(createdAt.getTime() + days * DAY_MS);
  return {
    createdAt,
    review: at(DAYS_AFTER_CREATION.review),
    approvals: [at(DAYS_AFTER_CREATION.firstApproval), at(DAYS_AFTER_CREATION.secondApproval)],
    validation: at(DAYS_AFTER_CREATION.validation),
    labEvidence: at(DAYS_AFTER_CREATION.labEvidence),
    pilot: at(DAYS_AFTER_CREATION.pilot),
    production: at(DAYS_AFTER_CREATION.production),
  };
}

/** The furthest stage on the promotion path a build reached (a withdrawn one: `withdrawnFrom`). */
export function reachedStage(stage: BuildStage, withdrawnFrom: BuildStage = "pilot"): BuildStage {
  return stage === "withdrawn" ? withdrawnFrom : stage;
}

export const reached = (stage: BuildStage, at: BuildStage) => PATH.indexOf(stage) >= PATH.indexOf(at);

/** Writes a demo file where the local storage driver keeps uploads, and records it. */
export async function storeDemoFile(db: Executor, input: { kind: "firmware" | "lab_report" | "measurements"; name: string; contentType: string; bytes: Buffer; uploadedByUserId: string; createdAt: Date }) {
  const key = randomUUID();
  const dir = path.resolve(process.env.STORAGE_DIR ?? ".data/uploads");
  fs.mkdirSync(dir, { recursive: true });
  fs.writeFileSync(path.join(dir, key), input.bytes, { mode: 0o600 });
  const [row] = await db
    .insert(uploads)
    .values({
      kind: input.kind,
      storageKey: key,
      originalName: input.name,
      contentType: input.contentType,
      sizeBytes: input.bytes.length,
      sha256: createHash("sha256").update(input.bytes).digest("hex"),
      uploadedByUserId: input.uploadedByUserId,
      createdAt: input.createdAt,
    })
    .returning({ id: uploads.id });
  return row!.id;
}

/** The demo firmware image of a build: a recognisable text padded to 256 bytes. */
export function demoFirmware(version: string): Buffer {
  return Buffer.from(`LOOPKEEPER DEMO FIRMWARE ${version}\n`.padEnd(256, "\0"), "latin1");
}

/** The quiet lab room of the demo, dB(A): a typical quiet test room (common practice, 20–25 dB(A)). */
export const DEMO_ROOM_BACKGROUND_DBA = 22;

/**
 * Invented lab figures for `hw`: at each operating point, the estimate plus a small rig
 * scatter, heard together with the room's background (levels add energetically:
 * 10·log10(10^(L1/10) + 10^(L2/10))). The background is stated once, on the first row.
 */
export function demoMeasurementsCsv(hw: HardwareContext, maxFanRpm: number): string {
  const points = [
    [25, 1200, 500, 0.3],
    [30, 1400, 700, 0.8],
    [40, 1800, 1100, -1.1],
    [45, 2200, 1500, 0.4],
    [50, 2600, 1900, 1.2],
    [55, 2900, 2300, -0.5],
  ] as const;
  const lines = points.map(([t, pumpRpm, fanRpm, scatterDb], i) => {
    const fan = Math.min(fanRpm, maxFanRpm);
    const coolerDbA = coolerNoise(hw, fan, pumpRpm).totalDbA1m + scatterDb;
    const heardDbA = 10 * Math.log10(10 ** (coolerDbA / 10) + 10 ** (DEMO_ROOM_BACKGROUND_DBA / 10));
    return `${t},${pumpRpm},${fan},${heardDbA.toFixed(1)},${i === 0 ? DEMO_ROOM_BACKGROUND_DBA.toFixed(1) : ""}`;
  });
  return [MEASUREMENT_HEADER_WITH_BACKGROUND, ...lines].join("\n") + "\n";
}

/**
 * Refuses demo evidence that would not pass the gate into pilot: the seed must never
 * contradict the rules the product enforces.
 */
export function assertDemoEvidencePasses(version: string, csv: string, hw: HardwareContext, toleranceDb: number) {
  const parsed = parseMeasurementsCsv(csv);
  if (!parsed.ok) throw new Error(`demo measurements of build ${version} do not parse: ${parsed.errors.join("; ")}`);
  const rows = compareMeasurements(parsed.rows, hw, toleranceDb);
  const issues = gateIssues(
    pilotGate({ labReport: true, measurements: true, sound: { state: "ok", issues: soundGateIssues(rows, toleranceDb), summary: soundGateSummary(rows, toleranceDb) }, waiverReason: null }),
  );
  if (issues.length > 0) throw new Error(`demo measurements of build ${version} fail the pilot gate: ${issues.join("; ")}`);
}

/**
 * Reviews and stage transitions of a demo build, dated along its timeline. Two approvals
 * (from `reviewers`, who wrote neither the build nor its profile versions) once it is past
 * review, one while in review.
 */
export async function insertDemoHistory(
  tx: Executor,
  input: {
    buildId: string;
    stage: BuildStage;
    timeline: ReturnType<typeof demoTimeline>;
    askedByUserId: string;
    releaseUserId: string;
    reviewers: readonly [string, string];
    releaseNotes: string | null;
    withdrawn: { from: BuildStage; at: Date; reason: string } | null;
  },
) {
  const top = reachedStage(input.stage, input.withdrawn?.from);
  const t = input.timeline;
  if (reached(top, "review")) {
    const approvers = reached(top, "validation") ? input.reviewers : input.reviewers.slice(0, 1);
    await tx.insert(buildReviews).values(
      approvers.map((reviewerUserId, i) => ({ buildId: input.buildId, reviewerUserId, verdict: "approve" as const, comment: "Curves and bank size checked.", createdAt: t.approvals[i]!, updatedAt: t.approvals[i]! })),
    );
  }
  const dates: Record<string, Date> = { review: t.review, validation: t.validation, pilot: t.pilot, production: t.production };
  const steps: (typeof buildTransitions.$inferInsert)[] = [];
  for (let i = 1; i <= PATH.indexOf(top); i++) {
    const to = PATH[i]!;
    steps.push({ buildId: input.buildId, fromStage: PATH[i - 1]!, toStage: to, actorUserId: i === 1 ? input.askedByUserId : input.releaseUserId, reason: to === "production" ? input.releaseNotes : null, createdAt: dates[to]! });
  }
  if (input.withdrawn) steps.push({ buildId: input.buildId, fromStage: top, toStage: "withdrawn", actorUserId: input.releaseUserId, reason: input.withdrawn.reason, createdAt: input.withdrawn.at });
  if (steps.length) await tx.insert(buildTransitions).values(steps);
}

