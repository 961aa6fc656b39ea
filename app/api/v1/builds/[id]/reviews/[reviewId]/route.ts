import { apiRoute } from "@/lib/platform/http/api-route";
import { changeReview } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/platform/auth/actor";
import { changeVerdict } from "@/lib/use-cases/builds/stages";

export const PATCH = apiRoute(changeReview, async ({ actor, params, body, requestId }) => ({
  review: await changeVerdict(
    { ...auditActor(actor, requestId), userId: actor.userId, role: actor.role, name: actor.name },
    { buildId: params.id, reviewId: params.reviewId, verdict: body.verdict, comment: body.comment },
  ),
}));
