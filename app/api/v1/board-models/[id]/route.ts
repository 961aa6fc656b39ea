import { apiRoute } from "@/lib/platform/http/api-route";
import { updateBoardModel } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import * as boards from "@/db/boards";
import { auditActor } from "@/lib/platform/auth/actor";

export const PUT = apiRoute(updateBoardModel, async ({ actor, params, body, requestId }) => ({
  boardModel: await boards.updateBoardModel(getDb(), auditActor(actor, requestId), { id: params.id, ...body }),
}));
