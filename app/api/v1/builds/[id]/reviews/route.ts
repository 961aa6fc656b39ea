import { apiRoute } from "@/lib/server/api";
import { reviewBuild } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/server/actor";
import { reviewBuild as addReview } from "@/lib/server/builds/stages";

export const POST = apiRoute(reviewBuild, async ({ actor, params, body, requestId }) => ({
  review: await addReview({ ...auditActor(actor, requestId), userId: actor.userId, role: actor.role, name: actor.name }, { buildId: params.id, verdict: body.verdict, comment: body.comment }),
}));
