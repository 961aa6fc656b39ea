import "server-only";
import type { Executor } from "@/db/client";
import { listRevisionsOfModel } from "@/db/boards";
import { getBuild, listBuildSlots, listReviews, listTransitions } from "@/db/builds";
import { getUploads } from "@/db/uploads";
import { AppError } from "@/lib/api/errors";
import { countingApprovers, openChangeRequests, reviewStanding } from "@/lib/release/approvals";
import { satisfiesRange } from "@/lib/engine";
import { env } from "@/lib/platform/env";
import { measurementComparison } from "@/lib/use-cases/builds/measurements";

/** Everything the build page shows, in one read. */
export async function buildDetail(db: Executor, { id }: { id: string }) {
  const build = await getBuild(db, { id });
  if (!build) throw new AppError("not_found", "No build with that id.");
  const [slots, reviews, transitions, revisions, uploads] = await Promise.all([
    listBuildSlots(db, { buildId: id }),
    listReviews(db, { buildId: id }),
    listTransitions(db, { buildId: id }),
    listRevisionsOfModel(db, { boardModelId: build.boardModelId }),
    getUploads(db, { ids: [build.firmwareUploadId, build.labReportUploadId, build.measurementsUploadId].filter((x): x is string => !!x) }),
  ]);
  const byId = new Map(uploads.map((u) => [u.id, u]));
  const authorship = { buildAuthorUserId: build.authorUserId, profileAuthorUserIds: new Set(slots.map((s) => s.authorUserId)) };
  return {
    build,
    slots: slots.map(({ authorUserId: _a, coolerModelId: _c, ...s }) => s),
    revisions: revisions.filter((r) => satisfiesRange(r.revision, build.revisionRange)).map((r) => ({ revision: r.revision, memoryBytes: r.memoryBytes, slotCount: r.slotCount, baseAddress: r.baseAddress })),
    uploads: {
      firmware: (build.firmwareUploadId && byId.get(build.firmwareUploadId)) || null,
      labReport: (build.labReportUploadId && byId.get(build.labReportUploadId)) || null,
      measurements: (build.measurementsUploadId && byId.get(build.measurementsUploadId)) || null,
    },
    // Each review says whether it counts now and, if not, why: the same rule the gate applies.
    reviews: reviews.map((r) => ({
      id: r.id,
      reviewerUserId: r.reviewerUserId,
      reviewerName: r.reviewerName,
      verdict: r.verdict,
      comment: r.comment,
      resolvedAt: r.resolvedAt,
      createdAt: r.createdAt,
      updatedAt: r.updatedAt,
      standing: reviewStanding(r, authorship),
    })),
    approvals: { counting: countingApprovers(reviews, authorship).length, required: env().REQUIRED_APPROVALS, openChangeRequests: openChangeRequests(reviews) },
    transitions,
    comparison: await measurementComparison(db, build),
  };
}
