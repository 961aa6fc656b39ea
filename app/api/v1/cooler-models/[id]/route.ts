import { apiRoute } from "@/lib/platform/http/api-route";
import { updateCoolerModel as updateCoolerModelOp } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { updateCoolerModel } from "@/lib/use-cases/registry/save-cooler-model";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const PUT = apiRoute(updateCoolerModelOp, async ({ actor, params, body, requestId }) => ({ coolerModel: await updateCoolerModel(getDb(), auditActor(actor, requestId), { id: params.id, ...body }) }));
