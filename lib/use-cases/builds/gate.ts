import "server-only";
import type { Executor } from "@/db/client";
import { getBuildRow, listBuildSlots, listReviews } from "@/db/builds";
import type { Build } from "@/db/schema";
import { AppError } from "@/lib/api/errors";
import { can, type Role } from "@/lib/auth/roles";
import { reviewerEligibility, type BuildAuthorship } from "@/lib/release/approvals";
import { gateOpen, pilotGate, productionGate, reviewGate, roleRequirement, validationGate, type GateRequirement, type SoundVerdict } from "@/lib/release/gates";
import { soundGateIssues, soundGateSummary } from "@/lib/release/measurements";
import { STAGE_LABELS, type Stage } from "@/lib/release/stages";
import { capabilityFor, nextStage, transitionShapeError } from "@/lib/release/transitions";
import { env } from "@/lib/platform/env";
import { checkStoredBuild } from "./check";
import { measurementComparison } from "./measurements";

/** Who wrote the build and its profile versions: they may not count as its reviewers. */
export async function buildAuthorship(db: Executor, build: Pick<Build, "id" | "authorUserId">): Promise<BuildAuthorship> {
  const slots = await listBuildSlots(db, { buildId: build.id });
  return { buildAuthorUserId: build.authorUserId, profileAuthorUserIds: new Set(slots.map((s) => s.authorUserId)) };
}

async function soundVerdict(db: Executor, build: Build): Promise<SoundVerdict> {
  const comparison = await measurementComparison(db, build);
  if (comparison.state !== "ok") return comparison;
  const issues = soundGateIssues(comparison.rows, comparison.toleranceDb);
  return { state: "ok", issues, summary: soundGateSummary(comparison.rows, comparison.toleranceDb) };
}

/**
 * The requirements of the gate into `to`, each with its state, for `mover`. The same
 * function judges a promotion (inside its transaction, build row locked) and feeds the
 * checklist the build page shows, so the two cannot disagree.
 * `releaseNotes` is undefined when previewing: they are then written with the promotion.
 */
export async function gateRequirements(db: Executor, build: Build, to: Stage, mover: { role: Role }, input: { releaseNotes?: string | null } = {}): Promise<GateRequirement[]> {
  const role = roleRequirement(mover.role, capabilityFor(to), to);
  switch (to) {
    case "review":
      return [role, ...reviewGate((await checkStoredBuild(db, build)).check)];
    case "validation":
      return [role, ...validationGate(await listReviews(db, { buildId: build.id }), await buildAuthorship(db, build), env().REQUIRED_APPROVALS)];
    case "pilot":
      return [
        role,
        ...pilotGate({ labReport: !!build.labReportUploadId, measurements: !!build.measurementsUploadId, sound: await soundVerdict(db, build), waiverReason: build.waiverReason }),
      ];
    case "production":
      // The release-manager line stands in for the role line: the same roles, said in the trade's words.
      return productionGate({ moverRole: mover.role, releaseNotes: input.releaseNotes });
    default:
      return [role];
  }
}

/** The checklist of the next stage on the promotion path, or null at the end of it. */
export async function nextGate(db: Executor, build: Build, viewer: { role: Role }) {
  const to = nextStage(build.stage);
  if (!to) return null;
  return { to, requirements: await gateRequirements(db, build, to, viewer) };
}

/**
 * The build page's checklist for `viewer`: the next stage's requirements with their states
 * (from `gateRequirements`, the function promotions are judged by), whether all hold, and
 * whether the viewer may review the build now (so only eligible reviewers see Approve).
 */
export async function buildGate(db: Executor, { id }: { id: string }, viewer: { userId: string; role: Role }) {
  const build = await getBuildRow(db, { id });
  if (!build) throw new AppError("not_found", "No build with that id.");
  const next = await nextGate(db, build, viewer);
  const [authorship, reviews] = await Promise.all([buildAuthorship(db, build), listReviews(db, { buildId: id })]);
  const own = reviews.find((r) => r.reviewerUserId === viewer.userId) ?? null;
  const eligibility = reviewerEligibility({ userId: viewer.userId, role: viewer.role, disabledAt: null }, authorship);
  const reviewReason =
    build.stage !== "review"
      ? `Reviews are taken while the build is in review; it is in ${STAGE_LABELS[build.stage].toLowerCase()}.`
      : !eligibility.counts
        ? (eligibility.reason ?? "You may not review this build.").replace(/^The reviewer/, "You")
        : null;
  return {
    stage: build.stage,
    next: next ? { ...next, ready: gateOpen(next.requirements) } : null,
    review: { mayReview: reviewReason === null, reason: reviewReason, ownReviewId: own?.id ?? null, ownVerdict: own?.verdict ?? null },
    mayWithdraw: can(viewer.role, "build:withdraw") && transitionShapeError(build.stage, "withdrawn") === null,
  };
}
