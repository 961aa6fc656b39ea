import { apiRoute } from "@/lib/platform/http/api-route";
import { updateComponent } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import * as components from "@/db/components";
import { auditActor } from "@/lib/platform/auth/actor";

export const PUT = apiRoute(updateComponent, async ({ actor, params, body, requestId }) => ({
  component: await components.updateComponent(getDb(), auditActor(actor, requestId), { id: params.id, ...body }),
}));
