import { apiRoute } from "@/lib/server/api";
import { createBoardModel, listBoardModels } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import * as boards from "@/db/boards";
import { auditActor } from "@/lib/server/actor";

export const GET = apiRoute(listBoardModels, async () => ({ items: await boards.listBoardModels(getDb()) }));

export const POST = apiRoute(createBoardModel, async ({ actor, body, requestId }) => ({
  boardModel: await boards.createBoardModel(getDb(), auditActor(actor, requestId), body),
}));
