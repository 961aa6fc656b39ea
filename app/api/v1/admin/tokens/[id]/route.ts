import { apiRoute } from "@/lib/platform/http/api-route";
import { revokeAnyToken } from "@/lib/api/operations/admin";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { revokeToken } from "@/lib/use-cases/account/tokens";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

/** An admin revokes anyone's token: `userId: null` lifts the ownership filter, the revocation is audited. */
export const DELETE = apiRoute(revokeAnyToken, async ({ actor, params, requestId }) => ({ token: await revokeToken(getDb(), auditActor(actor, requestId), { id: params.id, userId: null }) }));
