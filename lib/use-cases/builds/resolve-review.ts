import "server-only";
import type { Database } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { findReviewOfBuild, markReviewResolved } from "@/db/build-stages";
import { AppError } from "@/lib/api/errors";
import { lockedBuild } from "./locked";

/**
 * The build's author marks a change request as dealt with, audited, in one transaction. Only
 * the author may (403); only an unresolved change request of this build can be (404/409).
 */
export async function resolveChangeRequest(db: Database, actor: AuditActor & { userId: string }, { buildId, reviewId }: { buildId: string; reviewId: string }) {
  return db.transaction(async (tx) => {
    const build = await lockedBuild(tx, buildId);
    if (build.authorUserId !== actor.userId) throw new AppError("forbidden", "Only the build's author can mark a change request resolved.");
    const review = await findReviewOfBuild(tx, { buildId, reviewId });
    if (!review) throw new AppError("not_found", "No such review on this build.");
    if (review.verdict !== "request_changes") throw new AppError("conflict", "Only change requests can be resolved.");
    if (review.resolvedAt) throw new AppError("conflict", "That change request is already resolved.");
    const row = await markReviewResolved(tx, { id: reviewId });
    await recordAudit(tx, actor, { action: "build.review.resolve", entityType: "build", entityId: buildId, before: { reviewId, resolvedAt: null }, after: { reviewId, resolvedAt: row.resolvedAt } });
    return row;
  });
}
