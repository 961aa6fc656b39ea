import { apiRoute } from "@/lib/platform/http/api-route";
import { updateBoardModel as updateBoardModelOp } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { updateBoardModel } from "@/lib/use-cases/registry/save-board-model";

export const PUT = apiRoute(updateBoardModelOp, async ({ actor, params, body, requestId }) => ({ boardModel: await updateBoardModel(getDb(), auditActor(actor, requestId), { id: params.id, ...body }) }));
