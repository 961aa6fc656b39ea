import { apiRoute } from "@/lib/platform/http/api-route";
import { resolveReview } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import * as stages from "@/db/build-stages";
import { auditActor } from "@/lib/platform/auth/actor";

export const POST = apiRoute(resolveReview, async ({ actor, params, requestId }) => ({
  review: await stages.resolveReview(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, { buildId: params.id, reviewId: params.reviewId }),
}));
