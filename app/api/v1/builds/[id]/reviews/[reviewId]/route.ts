import { apiRoute } from "@/lib/server/api";
import { changeReview } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/server/actor";
import { changeVerdict } from "@/lib/server/builds/stages";

export const PATCH = apiRoute(changeReview, async ({ actor, params, body, requestId }) => ({
  review: await changeVerdict(
    { ...auditActor(actor, requestId), userId: actor.userId, role: actor.role, name: actor.name },
    { buildId: params.id, reviewId: params.reviewId, verdict: body.verdict, comment: body.comment },
  ),
}));
