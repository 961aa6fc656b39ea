import { apiRoute } from "@/lib/platform/http/api-route";
import { createBoardModel, listBoardModels } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import * as boards from "@/db/boards";
import { auditActor } from "@/lib/platform/auth/actor";
import { boardModelsWithRevisions } from "@/lib/use-cases/registry/read";

export const GET = apiRoute(listBoardModels, async () => boardModelsWithRevisions(getDb()));

export const POST = apiRoute(createBoardModel, async ({ actor, body, requestId }) => ({
  boardModel: await boards.createBoardModel(getDb(), auditActor(actor, requestId), body),
}));
