import { apiRoute } from "@/lib/platform/http/api-route";
import { changeReview } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/platform/auth/actor";
import { changeVerdict } from "@/lib/use-cases/builds/stages";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const PATCH = apiRoute(changeReview, async ({ actor, params, body, requestId }) => ({
  review: await changeVerdict(
    { ...auditActor(actor, requestId), userId: actor.userId, role: actor.role, name: actor.name },
    { buildId: params.id, reviewId: params.reviewId, verdict: body.verdict, comment: body.comment },
  ),
}));
