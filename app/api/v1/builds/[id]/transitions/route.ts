import { apiRoute } from "@/lib/platform/http/api-route";
import { transitionBuild } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/platform/auth/actor";
import { moveBuild } from "@/lib/use-cases/builds/stages";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(transitionBuild, async ({ actor, params, body, requestId }) => ({
  transition: await moveBuild({ ...auditActor(actor, requestId), userId: actor.userId, role: actor.role, name: actor.name }, { id: params.id, ...body }),
}));
