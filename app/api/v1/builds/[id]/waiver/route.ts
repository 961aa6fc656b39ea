import { apiRoute } from "@/lib/platform/http/api-route";
import { recordWaiver as recordWaiverOp } from "@/lib/api/operations/builds";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { recordWaiver } from "@/lib/use-cases/builds/waiver";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const POST = apiRoute(recordWaiverOp, async ({ actor, params, body, requestId }) => recordWaiver(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, { buildId: params.id, reason: body.reason }));
