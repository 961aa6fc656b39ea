import { apiRoute } from "@/lib/platform/http/api-route";
import { createToken, listTokens } from "@/lib/api/operations/account";
import { getDb } from "@/db/client";
import { auditActor } from "@/lib/platform/auth/actor";
import { issueToken, tokensOf } from "@/lib/use-cases/account/tokens";

// Every answer depends on who asks and when: never prerendered, and the request is not wrapped for static-generation tracking.
export const dynamic = "force-dynamic";

export const GET = apiRoute(listTokens, async ({ actor }) => tokensOf(getDb(), { userId: actor.userId }));

export const POST = apiRoute(createToken, async ({ actor, body, requestId }) => issueToken(getDb(), { ...auditActor(actor, requestId), userId: actor.userId }, body));
