import { apiRoute } from "@/lib/platform/http/api-route";
import { resolveReview } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { resolveChangeRequest } from "@/lib/use-cases/builds/resolve-review";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(resolveReview, async ({ actor, params, requestId }) => ({
  review: await resolveChangeRequest(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, { buildId: params.id, reviewId: params.reviewId }),
}));
