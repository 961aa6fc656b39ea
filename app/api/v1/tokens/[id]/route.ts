import { apiRoute } from "@/lib/platform/http/api-route";
import { revokeToken as revokeTokenOp } from "@/lib/api/operations/account";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { revokeToken } from "@/lib/use-cases/account/tokens";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const DELETE = apiRoute(revokeTokenOp, async ({ actor, params, requestId }) => ({ token: await revokeToken(getDb(), auditActor(actor, requestId), { id: params.id, userId: actor.userId }) }));
