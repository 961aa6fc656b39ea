import { apiRoute } from "@/lib/platform/http/api-route";
import { revokeToken } from "@/lib/api/operations/account";
import { getDb } from "@/db/client";
import * as tokens from "@/db/tokens";
import { auditActor } from "@/lib/platform/auth/actor";

export const DELETE = apiRoute(revokeToken, async ({ actor, params, requestId }) => ({
  token: await tokens.revokeToken(getDb(), auditActor(actor, requestId), { id: params.id, userId: actor.userId }),
}));
