import { apiRoute } from "@/lib/platform/http/api-route";
import { transitionBuild } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/platform/auth/actor";
import { moveBuild } from "@/lib/use-cases/builds/stages";

export const POST = apiRoute(transitionBuild, async ({ actor, params, body, requestId }) => ({
  transition: await moveBuild({ ...auditActor(actor, requestId), userId: actor.userId, role: actor.role, name: actor.name }, { id: params.id, ...body }),
}));
