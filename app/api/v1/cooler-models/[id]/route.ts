import { apiRoute } from "@/lib/platform/http/api-route";
import { updateCoolerModel } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import * as coolers from "@/db/cooler-models";
import { auditActor } from "@/lib/platform/auth/actor";

export const PUT = apiRoute(updateCoolerModel, async ({ actor, params, body, requestId }) => ({
  coolerModel: await coolers.updateCoolerModel(getDb(), auditActor(actor, requestId), { id: params.id, ...body }),
}));
