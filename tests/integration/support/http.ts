import { randomBytes } from "node:crypto";
import { NextRequest } from "next/server";
import { getDb } from "@/db/client";
import { createToken } from "@/lib/use-cases/account/tokens";
import { hashToken } from "@/lib/platform/auth/actor";
import { demoActor, tokensToRevoke } from "./db";

type RouteHandler = (req: NextRequest, ctx: { params: Promise<Record<string, string | string[]>> }) => Promise<Response>;

/** A fresh API token for a demo account, for calling route handlers as a machine client would. */
export async function tokenFor(email: string): Promise<string> {
  const actor = await demoActor(email);
  const secret = `lk_${randomBytes(32).toString("base64url")}`;
  const token = await createToken(getDb(), actor, { userId: actor.userId, name: "integration", tokenHash: hashToken(secret), tokenPrefix: secret.slice(0, 10), expiresAt: new Date(Date.now() + 3_600_000) });
  tokensToRevoke.push(token.id);
  return secret;
}

/** Calls a route handler in-process with a bearer token, as Next would. */
export async function callRoute(
  handler: RouteHandler,
  { url, method = "GET", token, body, params = {}, headers = {} }: { url: string; method?: string; token?: string; body?: BodyInit; params?: Record<string, string>; headers?: Record<string, string> },
): Promise<Response> {
  const req = new NextRequest(new URL(url, "http://127.0.0.1:3000"), {
    method,
    headers: { ...(token ? { authorization: `Bearer ${token}` } : {}), ...headers },
    body,
  });
  return handler(req, { params: Promise.resolve(params) });
}
