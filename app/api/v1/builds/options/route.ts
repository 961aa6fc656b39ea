import { apiRoute } from "@/lib/platform/http/api-route";
import { getBuildOptions } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { listBoardModels, listRevisions, listSlotCandidates } from "@/db/builds";

export const GET = apiRoute(getBuildOptions, async ({ query }) => {
  const db = getDb();
  const boardModels = await listBoardModels(db);
  const boardModelId = query.boardModelId ?? boardModels[0]?.id;
  if (!boardModelId) return { boardModels, revisions: [], candidates: [] };
  const [revisions, candidates] = await Promise.all([listRevisions(db, { boardModelId }), listSlotCandidates(db, { boardModelId })]);
  return {
    boardModels,
    revisions: revisions.map((r) => ({ revision: r.revision, memoryBytes: r.memoryBytes, slotCount: r.slotCount, maxPointsPerCurve: r.maxPointsPerCurve })),
    candidates,
  };
});
