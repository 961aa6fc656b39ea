import { apiRoute } from "@/lib/platform/http/api-route";
import { createBoardRevision as createBoardRevisionOp } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { createBoardRevision } from "@/lib/use-cases/registry/save-board-revision";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(createBoardRevisionOp, async ({ actor, params, body, requestId }) => ({
  revision: await createBoardRevision(getDb(), auditActor(actor, requestId), { boardModelId: params.id, ...body }),
}));
