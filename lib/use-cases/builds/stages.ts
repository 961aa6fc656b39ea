import "server-only";
import { getDb, type Tx } from "@/db/client";
import type { AuditActor } from "@/db/audit";
import { addReview, changeReview, transitionBuild } from "@/db/build-stages";
import { getBuild } from "@/db/builds";
import { emailsByRole } from "@/db/mail";
import type { Build, BuildStage } from "@/db/schema";
import { AppError } from "@/lib/api/errors";
import { can, ROLES, type Role } from "@/lib/auth/roles";
import { reviewerEligibility } from "@/lib/release/approvals";
import { gateIssues } from "@/lib/release/gates";
import { buildMail, type BuildMailFacts } from "@/lib/release/mail";
import { capabilityFor } from "@/lib/release/transitions";
import { env } from "@/lib/platform/env";
import { kickMailSender } from "@/lib/platform/mail/sender";
import { buildAuthorship, gateRequirements } from "./gate";

type Mover = AuditActor & { userId: string; role: Role; name: string };

async function mailFacts(tx: Tx, build: Build, actorName: string): Promise<BuildMailFacts & { authorEmail: string | null }> {
  const summary = await getBuild(tx, { id: build.id });
  return { buildId: build.id, boardModel: summary?.boardModel ?? "Board", version: build.version, actorName, baseUrl: env().NEXTAUTH_URL, authorEmail: summary?.authorEmail ?? null };
}

/** Roles whose holders may review a build (and so be asked to). */
const REVIEWING_ROLES = ROLES.filter((r) => can(r, "build:review"));

/**
 * Who hears of a stage change: review requests go only to people the server would let
 * approve this build; lab validation to release managers and the lab's list; pilot, factory
 * release and withdrawal to release managers and the build's author, the last two to support too.
 */
async function mailsFor(tx: Tx, build: Build, to: BuildStage, mover: Mover, note: string | null) {
  const facts = await mailFacts(tx, build, mover.name);
  const author = facts.authorEmail ? [facts.authorEmail] : [];
  switch (to) {
    case "review": {
      const authorship = await buildAuthorship(tx, build);
      const except = [authorship.buildAuthorUserId, ...authorship.profileAuthorUserIds];
      return buildMail("review_requested", facts, await emailsByRole(tx, { roles: REVIEWING_ROLES, exceptUserIds: except }));
    }
    case "validation":
      return buildMail("validation", facts, [...(await emailsByRole(tx, { roles: ["release_manager"] })), ...env().LAB_MAIL_LIST]);
    case "pilot":
      return buildMail("pilot", facts, [...(await emailsByRole(tx, { roles: ["release_manager"] })), ...author]);
    case "production":
    case "withdrawn":
      return buildMail(to, facts, [...(await emailsByRole(tx, { roles: ["release_manager", "support"] })), ...author], note);
    default:
      return [];
  }
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
    gate: async (tx, build) => (input.to === "withdrawn" ? [] : gateIssues(await gateRequirements(tx, build, input.to, mover, { releaseNotes: input.releaseNotes ?? null }))),
    mails: (tx, build) => mailsFor(tx, build, input.to, mover, input.to === "withdrawn" ? (input.reason ?? null) : (input.releaseNotes ?? null)),
  });
  kickMailSender();
  return transition;
}

/** Why `reviewer` may not review this build now, or null when they may (judged with the build locked). */
async function reviewerProblem(tx: Tx, build: Build, reviewer: Mover): Promise<string | null> {
  const standing = reviewerEligibility({ userId: reviewer.userId, role: reviewer.role, disabledAt: null }, await buildAuthorship(tx, build));
  if (standing.counts) return null;
  if (reviewer.userId === build.authorUserId) return "You created this build; someone else must review it.";
  return `You may not review this build: ${standing.reason ?? ""} Someone who wrote none of it must review it.`;
}

type ReviewRequest = { buildId: string; verdict: "approve" | "request_changes"; comment: string };

function reviewInput(reviewer: Mover, input: ReviewRequest) {
  return {
    ...input,
    ineligible: (tx: Tx, build: Build) => reviewerProblem(tx, build, reviewer),
    mails: async (tx: Tx, build: Build) => {
      const facts = await mailFacts(tx, build, reviewer.name);
      return facts.authorEmail ? buildMail(input.verdict === "approve" ? "approved" : "changes_requested", facts, [facts.authorEmail], input.comment) : [];
    },
  };
}

/** A reviewer approves or asks for changes, once per build; the author hears of it by mail. */
export async function reviewBuild(reviewer: Mover, input: ReviewRequest) {
  const review = await addReview(getDb(), reviewer, reviewInput(reviewer, input));
  kickMailSender();
  return review;
}

/** A reviewer changes their own verdict (an explicit update of the one review they have). */
export async function changeVerdict(reviewer: Mover, input: ReviewRequest & { reviewId: string }) {
  const review = await changeReview(getDb(), reviewer, { ...reviewInput(reviewer, input), reviewId: input.reviewId });
  kickMailSender();
  return review;
}
