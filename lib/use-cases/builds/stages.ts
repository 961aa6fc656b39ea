import "server-only";
import { getDb, type Tx } from "@/db/client";
import type { AuditActor } from "@/db/audit";
import { addReview, transitionBuild } from "@/db/build-stages";
import { getBuild, listBuildSlots, listReviews } from "@/db/builds";
import { emailsByRole } from "@/db/mail";
import type { Build, BuildStage } from "@/db/schema";
import { AppError } from "@/lib/api/errors";
import { can, type Role } from "@/lib/auth/roles";
import { approvalGateIssues } from "@/lib/release/approvals";
import { releaseMail, reviewRequestedMail, verdictMail, type BuildMailFacts } from "@/lib/release/mail";
import { soundGateIssues } from "@/lib/release/measurements";
import { capabilityFor } from "@/lib/release/transitions";
import { env } from "@/lib/platform/env";
import { kickMailSender } from "@/lib/platform/mail/sender";
import { checkStoredBuild } from "@/lib/use-cases/builds/check";
import { measurementComparison } from "@/lib/use-cases/builds/measurements";

type Mover = AuditActor & { userId: string; role: Role; name: string };

async function mailFacts(tx: Tx, build: Build, actorName: string): Promise<BuildMailFacts> {
  const summary = await getBuild(tx, { id: build.id });
  return { buildId: build.id, boardModel: summary?.boardModel ?? "Board", version: build.version, actorName, baseUrl: env().NEXTAUTH_URL };
}

async function profileAuthorIds(tx: Tx, buildId: string): Promise<string[]> {
  return (await listBuildSlots(tx, { buildId })).map((s) => s.authorUserId);
}

/** The gate of each stage, judged inside the transition's transaction with the build locked. */
async function gateIssues(tx: Tx, build: Build, to: BuildStage, mover: Mover): Promise<string[]> {
  switch (to) {
    case "review": {
      const { check } = await checkStoredBuild(tx, build);
      return check.ok ? [] : check.issues;
    }
    case "validation": {
      const excluded = new Set([build.authorUserId, ...(await profileAuthorIds(tx, build.id))]);
      return approvalGateIssues(await listReviews(tx, { buildId: build.id }), excluded, env().REQUIRED_APPROVALS);
    }
    case "pilot": {
      const issues: string[] = [];
      if (!build.labReportUploadId) issues.push("Attach the lab report (PDF).");
      if (!build.measurementsUploadId) issues.push("Attach the measurement CSV.");
      if (issues.length > 0 || build.waiverReason) return issues;
      const comparison = await measurementComparison(tx, build);
      if (comparison.state === "invalid") return comparison.errors;
      if (comparison.state === "ok") return soundGateIssues(comparison.rows, comparison.toleranceDb);
      return ["The measurement CSV could not be read; upload it again."];
    }
    case "production":
      return mover.role === "release_manager" || mover.role === "admin" ? [] : ["Only a release manager releases a build to the factory."];
    default:
      return [];
  }
}

async function mailsFor(tx: Tx, build: Build, to: BuildStage, mover: Mover, reason: string | null) {
  const facts = await mailFacts(tx, build, mover.name);
  if (to === "review") return reviewRequestedMail(facts, await emailsByRole(tx, { roles: ["engineer", "admin"], exceptUserIds: [build.authorUserId] }));
  if (to === "production" || to === "withdrawn") return releaseMail(facts, to, await emailsByRole(tx, { roles: ["release_manager", "support"] }), reason);
  return [];
}

/** Moves a build to `to` when the mover's role and the stage's gate allow it; then nudges the mail sender. */
export async function moveBuild(mover: Mover, input: { id: string; from: BuildStage; to: BuildStage; reason?: string; releaseNotes?: string }) {
  const needed = capabilityFor(input.to);
  if (!can(mover.role, needed)) throw new AppError("forbidden", `Your role (${mover.role}) may not move a build to ${input.to}.`);
  if (input.to === "withdrawn" && !input.reason?.trim()) throw new AppError("validation_failed", "Say why the build is withdrawn.", { issues: [{ path: "/reason", message: "Give a reason." }] });
  if (input.to === "production" && !input.releaseNotes?.trim()) throw new AppError("validation_failed", "Write release notes before releasing to the factory.", { issues: [{ path: "/releaseNotes", message: "Give release notes." }] });
  const transition = await transitionBuild(getDb(), mover, {
    id: input.id,
    from: input.from,
    to: input.to,
    reason: input.reason?.trim() || null,
    releaseNotes: input.releaseNotes?.trim() || null,
    gate: (tx, build) => gateIssues(tx, build, input.to, mover),
    mails: (tx, build) => mailsFor(tx, build, input.to, mover, input.to === "withdrawn" ? (input.reason ?? null) : (input.releaseNotes ?? null)),
  });
  kickMailSender();
  return transition;
}

/** A reviewer approves or asks for changes; the author hears of it by mail. */
export async function reviewBuild(reviewer: Mover, input: { buildId: string; verdict: "approve" | "request_changes"; comment: string }) {
  const review = await addReview(getDb(), reviewer, {
    ...input,
    profileAuthorIds: (tx) => profileAuthorIds(tx, input.buildId),
    mails: async (tx, build) => {
      const author = await getBuild(tx, { id: build.id });
      return author ? verdictMail(await mailFacts(tx, build, reviewer.name), author.authorEmail, input.verdict, input.comment) : [];
    },
  });
  kickMailSender();
  return review;
}
