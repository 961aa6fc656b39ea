import { randomBytes } from "node:crypto";
import { apiRoute } from "@/lib/platform/http/api-route";
import { createToken, listTokens } from "@/lib/api/operations/account";
import { getDb } from "@/db/client";
import * as tokens from "@/db/tokens";
import { auditActor, hashToken } from "@/lib/platform/auth/actor";

export const GET = apiRoute(listTokens, async ({ actor }) => ({ items: await tokens.listTokens(getDb(), { userId: actor.userId }) }));

export const POST = apiRoute(createToken, async ({ actor, body, requestId }) => {
  const secret = `lk_${randomBytes(32).toString("base64url")}`;
  const token = await tokens.createToken(getDb(), auditActor(actor, requestId), {
    userId: actor.userId,
    name: body.name,
    tokenHash: hashToken(secret),
    tokenPrefix: secret.slice(0, 10),
    expiresAt: new Date(Date.now() + body.expiresInDays * 86_400_000),
  });
  return { token, secret };
});
