import { apiRoute } from "@/lib/platform/http/api-route";
import { createCoolerModel as createCoolerModelOp, listCoolerModels } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { coolerModelsPage } from "@/lib/use-cases/registry/read";
import { createCoolerModel } from "@/lib/use-cases/registry/save-cooler-model";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listCoolerModels, async ({ query }) => coolerModelsPage(getDb(), query));

export const POST = apiRoute(createCoolerModelOp, async ({ actor, body, requestId }) => ({ coolerModel: await createCoolerModel(getDb(), auditActor(actor, requestId), body) }));
