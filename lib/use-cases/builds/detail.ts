import "server-only";
import type { Executor } from "@/db/client";
import { getBuild, listBuildSlots, listRevisions, listReviews, listTransitions } from "@/db/builds";
import { getUploads } from "@/db/uploads";
import { AppError } from "@/lib/api/errors";
import { countingApprovers, openChangeRequests } from "@/lib/release/approvals";
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
    listRevisions(db, { boardModelId: build.boardModelId }),
    getUploads(db, { ids: [build.firmwareUploadId, build.labReportUploadId, build.measurementsUploadId].filter((x): x is string => !!x) }),
  ]);
  const byId = new Map(uploads.map((u) => [u.id, u]));
  const excluded = new Set([build.authorUserId, ...slots.map((s) => s.authorUserId)]);
  return {
    build,
    slots: slots.map(({ authorUserId: _a, profileId: _p, coolerModelId: _c, ...s }) => s),
    revisions: revisions.filter((r) => satisfiesRange(r.revision, build.revisionRange)).map((r) => ({ revision: r.revision, memoryBytes: r.memoryBytes, slotCount: r.slotCount, baseAddress: r.baseAddress })),
    uploads: {
      firmware: (build.firmwareUploadId && byId.get(build.firmwareUploadId)) || null,
      labReport: (build.labReportUploadId && byId.get(build.labReportUploadId)) || null,
      measurements: (build.measurementsUploadId && byId.get(build.measurementsUploadId)) || null,
    },
    reviews,
    approvals: { counting: countingApprovers(reviews, excluded).length, required: env().REQUIRED_APPROVALS, openChangeRequests: openChangeRequests(reviews) },
    transitions,
    comparison: await measurementComparison(db, build),
  };
}
