import { apiRoute } from "@/lib/platform/http/api-route";
import { createCoolerModel, listCoolerModels } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import * as coolers from "@/db/cooler-models";
import { auditActor } from "@/lib/platform/auth/actor";
import { coolerModelsPage } from "@/lib/use-cases/registry/read";

export const GET = apiRoute(listCoolerModels, async ({ query }) => coolerModelsPage(getDb(), query));

export const POST = apiRoute(createCoolerModel, async ({ actor, body, requestId }) => ({
  coolerModel: await coolers.createCoolerModel(getDb(), auditActor(actor, requestId), body),
}));
