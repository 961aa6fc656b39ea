import { apiRoute } from "@/lib/server/api";
import { transitionBuild } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/server/actor";
import { moveBuild } from "@/lib/server/builds/stages";

export const POST = apiRoute(transitionBuild, async ({ actor, params, body, requestId }) => ({
  transition: await moveBuild({ ...auditActor(actor, requestId), userId: actor.userId, role: actor.role, name: actor.name }, { id: params.id, ...body }),
}));
