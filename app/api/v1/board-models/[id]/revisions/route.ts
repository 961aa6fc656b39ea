import { apiRoute } from "@/lib/platform/http/api-route";
import { createBoardRevision } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import * as boards from "@/db/boards";
import { auditActor } from "@/lib/platform/auth/actor";

export const POST = apiRoute(createBoardRevision, async ({ actor, params, body, requestId }) => ({
  revision: await boards.createBoardRevision(getDb(), auditActor(actor, requestId), { boardModelId: params.id, ...body }),
}));
