import "server-only";
import { and, desc, eq, ne, notExists, sql } from "drizzle-orm";
import { auditEvents, buildReviews, builds, buildStageEnum, boardModels, type BuildStage } from "./schema";
import type { Executor } from "./client";

export async function countBuildsByStage(db: Executor): Promise<Record<BuildStage, number>> {
  const rows = await db.select({ stage: builds.stage, n: sql<number>`count(*)::int` }).from(builds).groupBy(builds.stage);
  const out = Object.fromEntries(buildStageEnum.enumValues.map((s) => [s, 0])) as Record<BuildStage, number>;
  for (const r of rows) out[r.stage] = Number(r.n);
  return out;
}

/** Builds in review that this user did not author and has not yet reviewed. */
export async function reviewsWaitingFor(db: Executor, { userId }: { userId: string }) {
  return db
    .select({ id: builds.id, version: builds.version, boardModel: boardModels.name, updatedAt: builds.updatedAt })
    .from(builds)
    .innerJoin(boardModels, eq(boardModels.id, builds.boardModelId))
    .where(
      and(
        eq(builds.stage, "review"),
        ne(builds.authorUserId, userId),
        notExists(db.select({ one: sql`1` }).from(buildReviews).where(and(eq(buildReviews.buildId, builds.id), eq(buildReviews.reviewerUserId, userId)))),
      ),
    )
    .orderBy(desc(builds.updatedAt))
    .limit(10);
}

export async function recentActivity(db: Executor, { limit }: { limit: number }) {
  return db
    .select({
      id: auditEvents.id,
      actorUserId: auditEvents.actorUserId,
      actorLabel: auditEvents.actorLabel,
      action: auditEvents.action,
      entityType: auditEvents.entityType,
      entityId: auditEvents.entityId,
      before: auditEvents.before,
      after: auditEvents.after,
      createdAt: auditEvents.createdAt,
    })
    .from(auditEvents)
    .orderBy(desc(auditEvents.id))
    .limit(limit);
}
