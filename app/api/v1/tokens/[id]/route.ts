import { apiRoute } from "@/lib/platform/http/api-route";
import { revokeToken as revokeTokenOp } from "@/lib/api/operations/account";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { revokeToken } from "@/lib/use-cases/account/tokens";

export const DELETE = apiRoute(revokeTokenOp, async ({ actor, params, requestId }) => ({ token: await revokeToken(getDb(), auditActor(actor, requestId), { id: params.id, userId: actor.userId }) }));
