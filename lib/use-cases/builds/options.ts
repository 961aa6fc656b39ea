import "server-only";
import type { z } from "zod";
import type { Executor } from "@/db/client";
import { listBoardModels } from "@/db/boards";
import { listSlotCandidates } from "@/db/builds";
import type { buildOptionsQuery } from "@/lib/api/operations/builds";

/**
 * What the new-build form offers: the board models (the one board-model list), and for the
 * board model named in the query its revisions in semver order and the published profile
 * versions written for its coolers. With no board model named, only the list of board models:
 * nothing is offered for a board nobody picked.
 */
export async function buildFormOptions(db: Executor, query: z.output<typeof buildOptionsQuery>) {
  const models = await listBoardModels(db);
  const boardModels = models.map(({ id, name }) => ({ id, name }));
  const { boardModelId } = query;
  if (!boardModelId) return { boardModels, revisions: [], candidates: [] };
  const model = models.find((m) => m.id === boardModelId);
  const candidates = await listSlotCandidates(db, { boardModelId });
  return {
    boardModels,
    revisions: (model?.revisions ?? []).map((r) => ({ revision: r.revision, memoryBytes: r.memoryBytes, slotCount: r.slotCount, maxPointsPerCurve: r.maxPointsPerCurve })),
    candidates,
  };
}
