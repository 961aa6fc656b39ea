import { apiRoute } from "@/lib/platform/http/api-route";
import { recordWaiver } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import * as stages from "@/db/build-stages";
import { auditActor } from "@/lib/platform/auth/actor";

export const POST = apiRoute(recordWaiver, async ({ actor, params, body, requestId }) => {
  await stages.recordWaiver(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, { buildId: params.id, reason: body.reason });
  return { ok: true as const };
});
