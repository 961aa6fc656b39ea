import { apiRoute } from "@/lib/platform/http/api-route";
import { createComponent as createComponentOp, listComponents } from "@/lib/api/operations/registry";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { componentsPage } from "@/lib/use-cases/registry/read";
import { createComponent } from "@/lib/use-cases/registry/save-component";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listComponents, async ({ query }) => componentsPage(getDb(), query));

export const POST = apiRoute(createComponentOp, async ({ actor, body, requestId }) => ({ component: await createComponent(getDb(), auditActor(actor, requestId), body) }));
