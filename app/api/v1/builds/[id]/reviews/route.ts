import { apiRoute } from "@/lib/platform/http/api-route";
import { reviewBuild } from "@/lib/api/operations/builds";
import { auditActor } from "@/lib/platform/auth/actor";
import { reviewBuild as addReview } from "@/lib/use-cases/builds/stages";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(reviewBuild, async ({ actor, params, body, requestId }) => ({
  review: await addReview({ ...auditActor(actor, requestId), userId: actor.userId, role: actor.role, name: actor.name }, { buildId: params.id, verdict: body.verdict, comment: body.comment }),
}));
