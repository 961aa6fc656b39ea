import "server-only";
import { getDb, type Tx } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { signBuildBank } from "@/db/bank-signatures";
import { findReviewBy, insertReview, setBuildStage, updateReviewVerdict } from "@/db/build-stages";
import { getBuild } from "@/db/builds";
import { emailsByRole, enqueueMail } from "@/db/mail";
import type { Build, BuildStage } from "@/db/schema";
import { AppError } from "@/lib/api/errors";
import { can, ROLES, type Role } from "@/lib/auth/roles";
import { reviewerEligibility } from "@/lib/release/approvals";
import { gateIssues } from "@/lib/release/gates";
import { buildMail, type BuildMailFacts } from "@/lib/release/mail";
import { capabilityFor, transitionShapeError } from "@/lib/release/transitions";
import { env } from "@/lib/platform/env";
import { kickMailSender } from "@/lib/platform/mail/sender";
import { buildAuthorship, gateRequirements } from "./gate";
import { lockedBuild } from "./locked";

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

/**
 * Writes a stage change already judged: the stage, its build_transitions row and its audit
 * event; a build entering pilot has the bank the pilot run flashes signed in the same
 * transaction. Returns the transition and the build as it now is.
 */
export async function enterStage(tx: Tx, actor: AuditActor & { userId: string }, build: Build, { to, reason = null, releaseNotes = null }: { to: BuildStage; reason?: string | null; releaseNotes?: string | null }) {
  const moved = await setBuildStage(tx, { build, to, actorUserId: actor.userId, reason, releaseNotes });
  if (to === "pilot") await signBuildBank(tx, build);
  await recordAudit(tx, actor, {
    action: `build.${to === "withdrawn" ? "withdraw" : "promote"}`,
    entityType: "build",
    entityId: build.id,
    before: { stage: build.stage },
    after: { stage: to, ...(reason ? { reason } : {}), ...(releaseNotes ? { releaseNotes } : {}) },
  });
  return moved;
}

/**
 * Moves a build one stage when the mover's role and the stage's gate allow it, in one
 * transaction: row lock, expected-stage check (409 when someone moved it meanwhile, so of two
 * simultaneous promotions exactly one happens), the shape of the move (409), the gate judged
 * with the row locked (422 with its open requirements), then the change, its audit event and
 * its outgoing mail. The mail sender is nudged after the commit.
 */
export async function moveBuild(mover: Mover, input: { id: string; from: BuildStage; to: BuildStage; reason?: string; releaseNotes?: string }) {
  const needed = capabilityFor(input.to);
  if (!can(mover.role, needed)) throw new AppError("forbidden", `Your role (${mover.role}) may not move a build to ${input.to}.`);
  if (input.to === "withdrawn" && !input.reason?.trim()) throw new AppError("validation_failed", "Say why the build is withdrawn.", { issues: [{ path: "/reason", message: "Give a reason." }] });
  if (input.to === "production" && !input.releaseNotes?.trim()) throw new AppError("validation_failed", "Write release notes before releasing to the factory.", { issues: [{ path: "/releaseNotes", message: "Give release notes." }] });
  const reason = input.reason?.trim() || null;
  const releaseNotes = input.releaseNotes?.trim() || null;
  const transition = await getDb().transaction(async (tx) => {
    const build = await lockedBuild(tx, input.id);
    if (build.stage !== input.from) {
      throw new AppError("conflict", `The build is in ${build.stage} now, not ${input.from}; someone moved it meanwhile. Reload the page.`);
    }
    const shape = transitionShapeError(build.stage, input.to);
    if (shape) throw new AppError("conflict", shape);
    const issues = input.to === "withdrawn" ? [] : gateIssues(await gateRequirements(tx, build, input.to, mover, { releaseNotes: input.releaseNotes ?? null }));
    if (issues.length > 0) {
      throw new AppError("validation_failed", `The build cannot move to ${input.to} yet: ${issues[0]}`, { issues: issues.map((message) => ({ path: "", message })) });
    }
    const moved = await enterStage(tx, mover, build, { to: input.to, reason, releaseNotes });
    await enqueueMail(tx, await mailsFor(tx, moved.build, input.to, mover, input.to === "withdrawn" ? (input.reason ?? null) : (input.releaseNotes ?? null)));
    return moved.transition;
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

const verdictWords = (v: "approve" | "request_changes") => (v === "approve" ? "approved" : "requested changes on");

/**
 * The build locked for a review: it must be in review (409) and the reviewer eligible — not
 * its author nor an author of its profile versions, in a role that reviews (403). With the
 * reviewer's existing review, if any.
 */
async function lockForReview(tx: Tx, reviewer: Mover, buildId: string) {
  const build = await lockedBuild(tx, buildId);
  if (build.stage !== "review") throw new AppError("conflict", `Reviews are taken while a build is in review; this one is in ${build.stage}.`);
  const why = await reviewerProblem(tx, build, reviewer);
  if (why) throw new AppError("forbidden", why);
  return { build, existing: await findReviewBy(tx, { buildId: build.id, reviewerUserId: reviewer.userId }) };
}

/** The mail telling the build's author of a verdict. */
async function verdictMail(tx: Tx, build: Build, reviewer: Mover, input: ReviewRequest) {
  const facts = await mailFacts(tx, build, reviewer.name);
  return facts.authorEmail ? buildMail(input.verdict === "approve" ? "approved" : "changes_requested", facts, [facts.authorEmail], input.comment) : [];
}

/**
 * A reviewer approves or asks for changes, once per build, with its audit event and the mail
 * to the author in one transaction. A second review from the same reviewer is refused (409):
 * changing a verdict is `changeVerdict`; the unique index on (build, reviewer) is the last guard.
 */
export async function reviewBuild(reviewer: Mover, input: ReviewRequest) {
  const review = await getDb().transaction(async (tx) => {
    const { build, existing } = await lockForReview(tx, reviewer, input.buildId);
    if (existing) {
      throw new AppError(
        "conflict",
        `You already ${verdictWords(existing.verdict)} this build on ${existing.updatedAt.toISOString().slice(0, 10)}; one review per reviewer. To change your verdict, use "Change my verdict".`,
      );
    }
    const row = await insertReview(tx, { buildId: build.id, reviewerUserId: reviewer.userId, verdict: input.verdict, comment: input.comment });
    await recordAudit(tx, reviewer, { action: `build.review.${input.verdict}`, entityType: "build", entityId: build.id, after: { reviewId: row.id, verdict: input.verdict, comment: input.comment } });
    await enqueueMail(tx, await verdictMail(tx, build, reviewer, input));
    return row;
  });
  kickMailSender();
  return review;
}

/** A reviewer changes their own verdict: the same review row, updated, audited with before and after, and the author told. */
export async function changeVerdict(reviewer: Mover, input: ReviewRequest & { reviewId: string }) {
  const review = await getDb().transaction(async (tx) => {
    const { build, existing } = await lockForReview(tx, reviewer, input.buildId);
    if (!existing || existing.id !== input.reviewId) throw new AppError("not_found", "You have no review with that id on this build; send a new review instead.");
    if (existing.verdict === input.verdict && existing.comment === input.comment) throw new AppError("conflict", `Your review already says that (${verdictWords(existing.verdict)}); nothing changed.`);
    const row = await updateReviewVerdict(tx, { id: existing.id, verdict: input.verdict, comment: input.comment });
    await recordAudit(tx, reviewer, {
      action: "build.review.change",
      entityType: "build",
      entityId: build.id,
      before: { reviewId: existing.id, verdict: existing.verdict, comment: existing.comment },
      after: { reviewId: existing.id, verdict: input.verdict, comment: input.comment },
    });
    await enqueueMail(tx, await verdictMail(tx, build, reviewer, input));
    return row;
  });
  kickMailSender();
  return review;
}
