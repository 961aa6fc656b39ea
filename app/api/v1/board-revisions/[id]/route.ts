import { apiRoute } from "@/lib/platform/http/api-route";
import { getBoardRevision, updateBoardRevision } from "@/lib/api/operations/registry";
import { AppError } from "@/lib/api/errors";
import { getDb } from "@/db/client";
import * as boards from "@/db/boards";
import { listVersionsForBoardModel } from "@/db/profile-versions";
import { compatibilityCells } from "@/lib/registry/version-image";
import { auditActor } from "@/lib/platform/auth/actor";

export const GET = apiRoute(getBoardRevision, async ({ params }) => {
  const db = getDb();
  const found = await boards.getBoardRevision(db, { id: params.id });
  if (!found) throw new AppError("not_found", "No such board revision.");
  const siblings = (await boards.listRevisionsOfModel(db, { boardModelId: found.revision.boardModelId })).map((r) => ({ id: r.id, revision: r.revision, memoryBytes: r.memoryBytes, maxPointsPerCurve: r.maxPointsPerCurve }));
  const versions = await listVersionsForBoardModel(db, { boardModelId: found.revision.boardModelId });
  return {
    ...found,
    compatibility: { revisions: siblings, rows: versions.map((v) => ({ ...v, cells: compatibilityCells(v, siblings) })) },
  };
});

export const PUT = apiRoute(updateBoardRevision, async ({ actor, params, body, requestId }) => ({
  revision: await boards.updateBoardRevision(getDb(), auditActor(actor, requestId), { id: params.id, ...body }),
}));
