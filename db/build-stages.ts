import "server-only";
import { and, eq } from "drizzle-orm";
import { buildReviews, builds, buildTransitions, type Build, type BuildStage } from "./schema";
import type { Database, Tx } from "./client";
import { recordAudit, type AuditActor } from "./audit";
import { signBuildBank } from "./bank-signatures";
import { enqueueMail } from "./mail";
import { AppError } from "@/lib/api/errors";
import type { OutgoingMail } from "@/lib/release/mail";
import { transitionShapeError } from "@/lib/release/transitions";

type Actor = AuditActor & { userId: string };

/** Reads the build and holds its row lock until the transaction ends. */
export async function lockBuild(tx: Tx, { id }: { id: string }): Promise<Build> {
  const [row] = await tx.select().from(builds).where(eq(builds.id, id)).limit(1).for("update");
  if (!row) throw new AppError("not_found", "No build with that id.");
  return row;
}

export interface TransitionInput {
  id: string;
  /** The stage the caller saw; if the build moved meanwhile, the call is refused with 409. */
  from: BuildStage;
  to: BuildStage;
  reason?: string | null;
  releaseNotes?: string | null;
  /** Reasons the stage's gate is closed, judged with the row locked; empty lets it through. */
  gate: (tx: Tx, build: Build) => Promise<string[]>;
  /** Messages this move sends; queued in the same transaction. */
  mails: (tx: Tx, build: Build) => Promise<OutgoingMail[]>;
}

/**
 * Moves a build one stage: row lock, expected-stage check, gate, then the stage change,
 * its build_transitions row, its audit event and its outgoing mail — all one transaction,
 * so of two simultaneous promotions exactly one happens and the other gets 409.
 */
export async function transitionBuild(db: Database, actor: Actor, input: TransitionInput) {
  return db.transaction(async (tx) => {
    const build = await lockBuild(tx, { id: input.id });
    if (build.stage !== input.from) {
      throw new AppError("conflict", `The build is in ${build.stage} now, not ${input.from}; someone moved it meanwhile. Reload the page.`);
    }
    const shape = transitionShapeError(build.stage, input.to);
    if (shape) throw new AppError("conflict", shape);
    const issues = await input.gate(tx, build);
    if (issues.length > 0) {
      throw new AppError("validation_failed", `The build cannot move to ${input.to} yet: ${issues[0]}`, { issues: issues.map((message) => ({ path: "", message })) });
    }
    const patch: Partial<Build> = { stage: input.to, updatedAt: new Date() };
    if (input.to === "withdrawn") patch.withdrawnReason = input.reason ?? null;
    if (input.to === "production") patch.releaseNotes = input.releaseNotes ?? null;
    await tx.update(builds).set(patch).where(eq(builds.id, build.id));
    // The bank a pilot run flashes is signed now, in the same transaction as the move.
    if (input.to === "pilot") await signBuildBank(tx, build);
    const [transition] = await tx
      .insert(buildTransitions)
      .values({ buildId: build.id, fromStage: build.stage, toStage: input.to, actorUserId: actor.userId, reason: input.reason ?? input.releaseNotes ?? null })
      .returning();
    await recordAudit(tx, actor, {
      action: `build.${input.to === "withdrawn" ? "withdraw" : "promote"}`,
      entityType: "build",
      entityId: build.id,
      before: { stage: build.stage },
      after: { stage: input.to, ...(input.reason ? { reason: input.reason } : {}), ...(input.releaseNotes ? { releaseNotes: input.releaseNotes } : {}) },
    });
    await enqueueMail(tx, await input.mails(tx, { ...build, ...patch }));
    return transition!;
  });
}

type ReviewInput = {
  buildId: string;
  verdict: "approve" | "request_changes";
  comment: string;
  /** Why the reviewer may not review this build (judged with the build locked), or null. */
  ineligible: (tx: Tx, build: Build) => Promise<string | null>;
  mails: (tx: Tx, build: Build) => Promise<OutgoingMail[]>;
};

async function lockForReview(tx: Tx, actor: Actor, input: ReviewInput) {
  const build = await lockBuild(tx, { id: input.buildId });
  if (build.stage !== "review") throw new AppError("conflict", `Reviews are taken while a build is in review; this one is in ${build.stage}.`);
  const why = await input.ineligible(tx, build);
  if (why) throw new AppError("forbidden", why);
  const [existing] = await tx.select().from(buildReviews).where(and(eq(buildReviews.buildId, build.id), eq(buildReviews.reviewerUserId, actor.userId))).limit(1);
  return { build, existing };
}

const verdictWords = (v: "approve" | "request_changes") => (v === "approve" ? "approved" : "requested changes on");

/**
 * A reviewer's first verdict, with its audit event and the mail to the author, in one
 * transaction. A second one from the same reviewer is refused (409): changing a verdict
 * is the explicit update below; the unique index on (build, reviewer) is the last guard.
 */
export async function addReview(db: Database, actor: Actor, input: ReviewInput) {
  return db.transaction(async (tx) => {
    const { build, existing } = await lockForReview(tx, actor, input);
    if (existing) {
      throw new AppError(
        "conflict",
        `You already ${verdictWords(existing.verdict)} this build on ${existing.updatedAt.toISOString().slice(0, 10)}; one review per reviewer. To change your verdict, use "Change my verdict".`,
      );
    }
    const [review] = await tx.insert(buildReviews).values({ buildId: build.id, reviewerUserId: actor.userId, verdict: input.verdict, comment: input.comment }).returning();
    await recordAudit(tx, actor, { action: `build.review.${input.verdict}`, entityType: "build", entityId: build.id, after: { reviewId: review!.id, verdict: input.verdict, comment: input.comment } });
    await enqueueMail(tx, await input.mails(tx, build));
    return review!;
  });
}

/** The reviewer changes their own verdict: the same row, updated, audited with before and after. */
export async function changeReview(db: Database, actor: Actor, input: ReviewInput & { reviewId: string }) {
  return db.transaction(async (tx) => {
    const { build, existing } = await lockForReview(tx, actor, input);
    if (!existing || existing.id !== input.reviewId) throw new AppError("not_found", "You have no review with that id on this build; send a new review instead.");
    if (existing.verdict === input.verdict && existing.comment === input.comment) throw new AppError("conflict", `Your review already says that (${verdictWords(existing.verdict)}); nothing changed.`);
    const [review] = await tx
      .update(buildReviews)
      .set({ verdict: input.verdict, comment: input.comment, updatedAt: new Date(), resolvedAt: null })
      .where(eq(buildReviews.id, existing.id))
      .returning();
    await recordAudit(tx, actor, {
      action: "build.review.change",
      entityType: "build",
      entityId: build.id,
      before: { reviewId: existing.id, verdict: existing.verdict, comment: existing.comment },
      after: { reviewId: existing.id, verdict: input.verdict, comment: input.comment },
    });
    await enqueueMail(tx, await input.mails(tx, build));
    return review!;
  });
}

/** The build's author marks a change request as dealt with. */
export async function resolveReview(db: Database, actor: Actor, { buildId, reviewId }: { buildId: string; reviewId: string }) {
  return db.transaction(async (tx) => {
    const build = await lockBuild(tx, { id: buildId });
    if (build.authorUserId !== actor.userId) throw new AppError("forbidden", "Only the build's author can mark a change request resolved.");
    const [review] = await tx.select().from(buildReviews).where(and(eq(buildReviews.id, reviewId), eq(buildReviews.buildId, buildId))).limit(1);
    if (!review) throw new AppError("not_found", "No such review on this build.");
    if (review.verdict !== "request_changes") throw new AppError("conflict", "Only change requests can be resolved.");
    if (review.resolvedAt) throw new AppError("conflict", "That change request is already resolved.");
    const [row] = await tx.update(buildReviews).set({ resolvedAt: new Date() }).where(eq(buildReviews.id, reviewId)).returning();
    await recordAudit(tx, actor, { action: "build.review.resolve", entityType: "build", entityId: buildId, before: { reviewId, resolvedAt: null }, after: { reviewId, resolvedAt: row!.resolvedAt } });
    return row!;
  });
}

/** A release manager accepts the lab's sound levels despite the estimate, with a reason. */
export async function recordWaiver(db: Database, actor: Actor, { buildId, reason }: { buildId: string; reason: string }) {
  return db.transaction(async (tx) => {
    const build = await lockBuild(tx, { id: buildId });
    if (build.stage !== "validation") throw new AppError("conflict", `A waiver is recorded during lab validation; this build is in ${build.stage}.`);
    await tx.update(builds).set({ waiverReason: reason, updatedAt: new Date() }).where(eq(builds.id, buildId));
    await recordAudit(tx, actor, { action: "build.waiver", entityType: "build", entityId: buildId, before: { waiverReason: build.waiverReason }, after: { waiverReason: reason } });
  });
}

/** Stages during which lab evidence may still be attached or replaced. */
const EVIDENCE_STAGES: readonly BuildStage[] = ["draft", "review", "validation"];

/** Attaches a lab report or measurement file to a build (the upload row is made in the same transaction). */
export async function attachEvidence(tx: Tx, actor: Actor, { buildId, kind, uploadId }: { buildId: string; kind: "lab_report" | "measurements"; uploadId: string }) {
  const build = await lockBuild(tx, { id: buildId });
  if (!EVIDENCE_STAGES.includes(build.stage)) throw new AppError("conflict", `Lab evidence is attached before the pilot run; this build is in ${build.stage}.`);
  const column = kind === "lab_report" ? "labReportUploadId" : "measurementsUploadId";
  await tx.update(builds).set({ [column]: uploadId, updatedAt: new Date() }).where(eq(builds.id, buildId));
  await recordAudit(tx, actor, { action: `build.attach.${kind}`, entityType: "build", entityId: buildId, before: { [column]: build[column] }, after: { [column]: uploadId } });
}
