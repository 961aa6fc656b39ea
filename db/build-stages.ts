import "server-only";
import { and, eq } from "drizzle-orm";
import { buildReviews, builds, buildTransitions, type Build, type BuildReview, type BuildStage } from "./schema";
import type { Executor } from "./client";

/** Reads the build and holds its row lock until the transaction ends; undefined when there is none. */
export async function lockBuild(tx: Executor, { id }: { id: string }): Promise<Build | undefined> {
  const [row] = await tx.select().from(builds).where(eq(builds.id, id)).limit(1).for("update");
  return row;
}

/**
 * Puts a build in stage `to` and writes its build_transitions row. A withdrawal keeps its
 * reason on the build, a factory release its notes; the transition row keeps whichever was given.
 * Returns the transition and the build as it now is.
 */
export async function setBuildStage(
  tx: Executor,
  { build, to, actorUserId, reason, releaseNotes }: { build: Build; to: BuildStage; actorUserId: string; reason: string | null; releaseNotes: string | null },
) {
  const patch: Partial<Build> = { stage: to, updatedAt: new Date() };
  if (to === "withdrawn") patch.withdrawnReason = reason;
  if (to === "production") patch.releaseNotes = releaseNotes;
  await tx.update(builds).set(patch).where(eq(builds.id, build.id));
  const [transition] = await tx
    .insert(buildTransitions)
    .values({ buildId: build.id, fromStage: build.stage, toStage: to, actorUserId, reason: reason ?? releaseNotes })
    .returning();
  if (!transition) throw new Error("INSERT … RETURNING gave no row");
  return { transition, build: { ...build, ...patch } };
}

/** The review one reviewer has given on a build, if any. */
export async function findReviewBy(tx: Executor, { buildId, reviewerUserId }: { buildId: string; reviewerUserId: string }): Promise<BuildReview | undefined> {
  const [row] = await tx.select().from(buildReviews).where(and(eq(buildReviews.buildId, buildId), eq(buildReviews.reviewerUserId, reviewerUserId))).limit(1);
  return row;
}

/** A review by its id, if it belongs to this build. */
export async function findReviewOfBuild(tx: Executor, { buildId, reviewId }: { buildId: string; reviewId: string }): Promise<BuildReview | undefined> {
  const [row] = await tx.select().from(buildReviews).where(and(eq(buildReviews.id, reviewId), eq(buildReviews.buildId, buildId))).limit(1);
  return row;
}

/** Writes a reviewer's verdict; the unique index on (build, reviewer) refuses a second one. */
export async function insertReview(tx: Executor, input: { buildId: string; reviewerUserId: string; verdict: BuildReview["verdict"]; comment: string }): Promise<BuildReview> {
  const [row] = await tx.insert(buildReviews).values(input).returning();
  if (!row) throw new Error("INSERT … RETURNING gave no row");
  return row;
}

/** Replaces a review's verdict and comment; a changed verdict is a fresh one, so an earlier resolution is cleared. */
export async function updateReviewVerdict(tx: Executor, { id, verdict, comment }: { id: string; verdict: BuildReview["verdict"]; comment: string }): Promise<BuildReview> {
  const [row] = await tx.update(buildReviews).set({ verdict, comment, updatedAt: new Date(), resolvedAt: null }).where(eq(buildReviews.id, id)).returning();
  if (!row) throw new Error("UPDATE … RETURNING gave no row");
  return row;
}

export async function markReviewResolved(tx: Executor, { id }: { id: string }): Promise<BuildReview> {
  const [row] = await tx.update(buildReviews).set({ resolvedAt: new Date() }).where(eq(buildReviews.id, id)).returning();
  if (!row) throw new Error("UPDATE … RETURNING gave no row");
  return row;
}

export async function setWaiverReason(tx: Executor, { buildId, reason }: { buildId: string; reason: string }): Promise<void> {
  await tx.update(builds).set({ waiverReason: reason, updatedAt: new Date() }).where(eq(builds.id, buildId));
}

/** Points a build at an uploaded lab report or measurement file. */
export async function setEvidenceUpload(tx: Executor, { buildId, kind, uploadId }: { buildId: string; kind: "lab_report" | "measurements"; uploadId: string }): Promise<void> {
  const column = kind === "lab_report" ? "labReportUploadId" : "measurementsUploadId";
  await tx.update(builds).set({ [column]: uploadId, updatedAt: new Date() }).where(eq(builds.id, buildId));
}
