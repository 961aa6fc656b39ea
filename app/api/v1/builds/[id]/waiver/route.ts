import { apiRoute } from "@/lib/server/api";
import { recordWaiver } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import * as stages from "@/db/build-stages";
import { auditActor } from "@/lib/server/actor";

export const POST = apiRoute(recordWaiver, async ({ actor, params, body, requestId }) => {
  await stages.recordWaiver(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, { buildId: params.id, reason: body.reason });
  return { ok: true };
});
