import { apiRoute } from "@/lib/platform/http/api-route";
import { createBoardRevision as createBoardRevisionOp } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { createBoardRevision } from "@/lib/use-cases/registry/save-board-revision";

export const POST = apiRoute(createBoardRevisionOp, async ({ actor, params, body, requestId }) => ({
  revision: await createBoardRevision(getDb(), auditActor(actor, requestId), { boardModelId: params.id, ...body }),
}));
