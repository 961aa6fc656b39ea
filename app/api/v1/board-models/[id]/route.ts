import { apiRoute } from "@/lib/platform/http/api-route";
import { updateBoardModel as updateBoardModelOp } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { updateBoardModel } from "@/lib/use-cases/registry/save-board-model";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const PUT = apiRoute(updateBoardModelOp, async ({ actor, params, body, requestId }) => ({ boardModel: await updateBoardModel(getDb(), auditActor(actor, requestId), { id: params.id, ...body }) }));
