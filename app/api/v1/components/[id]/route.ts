import { apiRoute } from "@/lib/platform/http/api-route";
import { updateComponent as updateComponentOp } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { updateComponent } from "@/lib/use-cases/registry/save-component";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const PUT = apiRoute(updateComponentOp, async ({ actor, params, body, requestId }) => ({ component: await updateComponent(getDb(), auditActor(actor, requestId), { id: params.id, ...body }) }));
