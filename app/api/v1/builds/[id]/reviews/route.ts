import { apiRoute } from "@/lib/platform/http/api-route";
import { reviewBuild } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/platform/auth/actor";
import { reviewBuild as addReview } from "@/lib/use-cases/builds/stages";

export const POST = apiRoute(reviewBuild, async ({ actor, params, body, requestId }) => ({
  review: await addReview({ ...auditActor(actor, requestId), userId: actor.userId, role: actor.role, name: actor.name }, { buildId: params.id, verdict: body.verdict, comment: body.comment }),
}));
