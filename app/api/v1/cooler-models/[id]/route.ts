import { apiRoute } from "@/lib/platform/http/api-route";
import { updateCoolerModel as updateCoolerModelOp } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { updateCoolerModel } from "@/lib/use-cases/registry/save-cooler-model";

export const PUT = apiRoute(updateCoolerModelOp, async ({ actor, params, body, requestId }) => ({ coolerModel: await updateCoolerModel(getDb(), auditActor(actor, requestId), { id: params.id, ...body }) }));
