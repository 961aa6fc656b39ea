import "server-only";
import type { z } from "zod";
import type { Executor } from "@/db/client";
import { listBoardModels } from "@/db/boards";
import { listSlotCandidates } from "@/db/builds";
import type { buildOptionsQuery } from "@/lib/api/operations/builds";

/**
 * What the new-build form offers: the board models (the one board-model list), and for the
 * chosen one (or the first) its revisions in semver order and the published profile
 * versions written for its coolers.
 */
export async function buildFormOptions(db: Executor, query: z.output<typeof buildOptionsQuery>) {
  const models = await listBoardModels(db);
  const boardModels = models.map(({ id, name }) => ({ id, name }));
  const model = query.boardModelId ? models.find((m) => m.id === query.boardModelId) : models[0];
  const boardModelId = query.boardModelId ?? model?.id;
  if (!boardModelId) return { boardModels, revisions: [], candidates: [] };
  const candidates = await listSlotCandidates(db, { boardModelId });
  return {
    boardModels,
    revisions: (model?.revisions ?? []).map((r) => ({ revision: r.revision, memoryBytes: r.memoryBytes, slotCount: r.slotCount, maxPointsPerCurve: r.maxPointsPerCurve })),
    candidates,
  };
}
