import { apiRoute } from "@/lib/platform/http/api-route";
import { createBoardModel as createBoardModelOp, listBoardModels } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { boardModelsWithRevisions } from "@/lib/use-cases/registry/read";
import { createBoardModel } from "@/lib/use-cases/registry/save-board-model";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listBoardModels, async () => boardModelsWithRevisions(getDb()));

export const POST = apiRoute(createBoardModelOp, async ({ actor, body, requestId }) => ({ boardModel: await createBoardModel(getDb(), auditActor(actor, requestId), body) }));
