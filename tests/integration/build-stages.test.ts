import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, getDb } from "./support/db";
import { chunksOf, demoBoardId, freshDraftBuild, freshProfileVersions, mover } from "./support/builds";
import { auditEvents, buildTransitions, builds, mailOutbox } from "@/db/schema";
import { moveBuild, reviewBuild } from "@/lib/use-cases/builds/stages";
import { recordWaiver } from "@/lib/use-cases/builds/waiver";
import { acceptUpload } from "@/lib/use-cases/builds/uploads";
import { attachEvidence } from "@/lib/use-cases/builds/evidence";
import { AppError } from "@/lib/api/errors";
import { coolerNoise } from "@/lib/engine";
import { MEASUREMENT_HEADER } from "@/lib/release/measurements";
import { tinyPdf } from "@/db/seed/builds";
import { checkSlots, checkStoredBuild } from "@/lib/use-cases/builds/check";
import { buildFormOptions } from "@/lib/use-cases/builds/options";
import { toHardwareContext } from "@/lib/registry/hardware-context";

// Background delivery passes after a transition must not reach anybody's SMTP server.
process.env.SMTP_PORT = "1";

afterAll(closeDb);

type Mover = Awaited<ReturnType<typeof mover>>;
let engineer: Mover, engineer2: Mover, engineer3: Mover, release: Mover, viewer: Mover;

beforeAll(async () => {
  engineer = await mover("engineer@tarnwell.example");
  engineer2 = await mover("engineer2@tarnwell.example");
  engineer3 = await mover("engineer3@tarnwell.example");
  release = await mover("release@tarnwell.example");
  viewer = await mover("viewer@tarnwell.example");
});

async function refusal(p: Promise<unknown>): Promise<AppError> {
  const err = await p.then(() => null, (e: unknown) => e);
  expect(err).toBeInstanceOf(AppError);
  return err as AppError;
}

async function inReviewWithApprovals(n: number) {
  const b = await freshDraftBuild();
  await moveBuild(engineer, { id: b.id, from: "draft", to: "review" });
  const reviewers = [engineer2, engineer3];
  for (let i = 0; i < n; i++) await reviewBuild(reviewers[i]!, { buildId: b.id, verdict: "approve", comment: "" });
  return b;
}

async function uploadEvidence(buildId: string, kind: "lab_report" | "measurements", bytes: Buffer, name: string) {
  const who = { userId: release.userId, label: release.label };
  return acceptUpload(who, { kind, name, body: chunksOf(bytes), attach: (tx, row) => attachEvidence(tx, who, { buildId, kind, uploadId: row.id }) });
}

/** Lab CSV whose sound column is the engine's estimate at each speed plus `offsetDb`. */
async function measurementCsv(build: { id: string }, offsetDb: number) {
  const db = getDb();
  const [row] = await db.select().from(builds).where(eq(builds.id, build.id));
  const { slots, revisions } = await checkStoredBuild(db, row!);
  const hw = toHardwareContext({ cooler: slots[0]!.cooler, fan: slots[0]!.fan, pump: slots[0]!.pump, revision: revisions[0]! });
  const speeds = [[35, 1600, 900], [45, 2200, 1400], [55, 2900, 2000]] as const;
  return Buffer.from([MEASUREMENT_HEADER, ...speeds.map(([t, p, f]) => `${t},${p},${f},${(coolerNoise(hw, f, p).totalDbA1m + offsetDb).toFixed(2)}`)].join("\n"));
}

describe("build stages", () => {
  it("lets exactly one of 20 simultaneous promotions through; the others get 409", async () => {
    const b = await inReviewWithApprovals(2);
    const results = await Promise.allSettled(Array.from({ length: 20 }, () => moveBuild(release, { id: b.id, from: "review", to: "validation" })));
    const won = results.filter((r) => r.status === "fulfilled");
    const lost = results.filter((r): r is PromiseRejectedResult => r.status === "rejected");
    expect(won).toHaveLength(1);
    expect(lost).toHaveLength(19);
    for (const l of lost) expect((l.reason as AppError).status).toBe(409);
    const db = getDb();
    const transitions = await db.select().from(buildTransitions).where(and(eq(buildTransitions.buildId, b.id), eq(buildTransitions.toStage, "validation")));
    expect(transitions).toHaveLength(1);
    const events = await db.select().from(auditEvents).where(and(eq(auditEvents.entityId, b.id), eq(auditEvents.action, "build.promote")));
    // One for draft → review, one for review → validation.
    expect(events.map((e) => (e.after as { stage: string }).stage).sort()).toEqual(["review", "validation"]);
  });

  it("refuses an author approving their own build", async () => {
    const b = await freshDraftBuild();
    await moveBuild(engineer, { id: b.id, from: "draft", to: "review" });
    const err = await refusal(reviewBuild(engineer, { buildId: b.id, verdict: "approve", comment: "" }));
    expect(err.status).toBe(403);
    expect(err.message).toMatch(/you created this build/i);
  });

  it("refuses a viewer promoting, whatever the stage", async () => {
    const b = await inReviewWithApprovals(2);
    const err = await refusal(moveBuild(viewer, { id: b.id, from: "review", to: "validation" }));
    expect(err.status).toBe(403);
    const [row] = await getDb().select().from(builds).where(eq(builds.id, b.id));
    expect(row!.stage).toBe("review");
  });

  it("refuses promotion into validation with too few approvals, or an open change request", async () => {
    const b = await inReviewWithApprovals(1);
    let err = await refusal(moveBuild(release, { id: b.id, from: "review", to: "validation" }));
    expect(err.status).toBe(422);
    expect(err.message).toMatch(/1 of 2 required approvals/);
    await reviewBuild(engineer3, { buildId: b.id, verdict: "request_changes", comment: "Pump floor too low at 20 °C." });
    err = await refusal(moveBuild(release, { id: b.id, from: "review", to: "validation" }));
    expect(err.issues?.map((i) => i.message).join(" ")).toMatch(/change request is still open/);
  });

  it("refuses skipping a stage, and withdrawing without a reason", async () => {
    const b = await freshDraftBuild();
    expect((await refusal(moveBuild(release, { id: b.id, from: "draft", to: "validation" }))).status).toBe(409);
    await moveBuild(engineer, { id: b.id, from: "draft", to: "review" });
    expect((await refusal(moveBuild(release, { id: b.id, from: "review", to: "withdrawn", reason: " " }))).status).toBe(422);
  });

  it("refuses pilot without lab evidence or with sound outside the tolerance, until a waiver", async () => {
    const b = await inReviewWithApprovals(2);
    await moveBuild(release, { id: b.id, from: "review", to: "validation" });
    let err = await refusal(moveBuild(release, { id: b.id, from: "validation", to: "pilot" }));
    expect(err.issues?.map((i) => i.message)).toEqual(["Attach the lab report (PDF).", "Attach the measurement CSV.", "No measurements to compare with the estimate yet."]);

    await uploadEvidence(b.id, "lab_report", tinyPdf("lab"), "report.pdf");
    // 5 dB above the estimate is outside the default 3 dB tolerance.
    await uploadEvidence(b.id, "measurements", await measurementCsv(b, 5), "loud.csv");
    err = await refusal(moveBuild(release, { id: b.id, from: "validation", to: "pilot" }));
    expect(err.message).toMatch(/3 of 3 comparable measured sound levels exceed the estimate by more than 3 dB/);

    await recordWaiver(getDb(), release, { buildId: b.id, reason: "Rig background noise was high that day; re-measured by ear." });
    await moveBuild(release, { id: b.id, from: "validation", to: "pilot" });
    err = await refusal(moveBuild(release, { id: b.id, from: "pilot", to: "production" }));
    expect(err.message).toMatch(/release notes/i);
    await moveBuild(release, { id: b.id, from: "pilot", to: "production", releaseNotes: "Factory release." });
    const mails = await getDb().select().from(mailOutbox).where(eq(mailOutbox.subject, `[Loopkeeper] Build TC-1 cooler controller ${(await getDb().select().from(builds).where(eq(builds.id, b.id)))[0]!.version} was released to the factory`));
    expect(mails).toHaveLength(1);
    expect(mails[0]!.toAddresses).toEqual(expect.arrayContaining(["release@tarnwell.example", "support@tarnwell.example"]));
  });

  it("passes the sound gate when measurements are within the tolerance", async () => {
    const b = await inReviewWithApprovals(2);
    await moveBuild(release, { id: b.id, from: "review", to: "validation" });
    await uploadEvidence(b.id, "lab_report", tinyPdf("lab"), "report.pdf");
    await uploadEvidence(b.id, "measurements", await measurementCsv(b, -1.5), "ok.csv");
    await moveBuild(release, { id: b.id, from: "validation", to: "pilot" });
    const [row] = await getDb().select().from(builds).where(eq(builds.id, b.id));
    expect(row!.stage).toBe("pilot");
  });

  it("refuses slots whose board range leaves out a revision in the build's range, naming both", async () => {
    const versions = await freshProfileVersions("engineer@tarnwell.example", "^2.0.0");
    const { check } = await checkSlots(getDb(), { boardModelId: await demoBoardId(), revisionRange: ">=1.1.0 <3.0.0", profileVersionIds: versions.map((v) => v.id) });
    expect(check.ok).toBe(false);
    expect(check.ok ? "" : check.issues[0]).toMatch(/is for board revisions \^2\.0\.0; revision 1\.1\.0 is in the build's range/);
  });

  it("offers the new-build form no revisions or versions until a board model is named, then that board's", async () => {
    const none = await buildFormOptions(getDb(), {});
    expect(none.boardModels.length).toBeGreaterThan(0);
    expect(none.revisions).toEqual([]);
    expect(none.candidates).toEqual([]);
    const boardModelId = await demoBoardId();
    const named = await buildFormOptions(getDb(), { boardModelId });
    expect(named.revisions.length).toBeGreaterThan(0);
    expect(named.candidates.length).toBeGreaterThan(0);
  });
});
