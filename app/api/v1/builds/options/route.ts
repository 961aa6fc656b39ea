import { apiRoute } from "@/lib/platform/http/api-route";
import { getBuildOptions } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { listBoardModels, listRevisionsOfModel } from "@/db/boards";
import { listSlotCandidates } from "@/db/builds";

export const GET = apiRoute(getBuildOptions, async ({ query }) => {
  const db = getDb();
  const boardModels = (await listBoardModels(db)).map(({ id, name }) => ({ id, name }));
  const boardModelId = query.boardModelId ?? boardModels[0]?.id;
  if (!boardModelId) return { boardModels, revisions: [], candidates: [] };
  const [revisions, candidates] = await Promise.all([listRevisionsOfModel(db, { boardModelId }), listSlotCandidates(db, { boardModelId })]);
  return {
    boardModels,
    revisions: revisions.map((r) => ({ revision: r.revision, memoryBytes: r.memoryBytes, slotCount: r.slotCount, maxPointsPerCurve: r.maxPointsPerCurve })),
    candidates,
  };
});
