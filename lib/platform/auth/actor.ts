import "server-only";
import { createHash } from "node:crypto";
import { getServerSession } from "next-auth";
import { connection } from "next/server";
import { cache } from "react";
import { getDb } from "@/db/client";
import { getUserById } from "@/db/users";
import { noteRequestStat } from "@/db/request-stats";
import { findTokenActor, touchToken } from "@/db/tokens";
import type { AuditActor } from "@/db/audit";
import type { Role } from "@/lib/auth/roles";
import { actorCaches, type CachedUser } from "./actor-cache";
import { authOptions } from "@/lib/platform/auth/options";

/** Who is making this request, as the server established it. */
export interface Actor {
  userId: string;
  email: string;
  name: string;
  role: Role;
  via: "session" | "token";
  tokenId?: string;
}

export function hashToken(secret: string): string {
  return createHash("sha256").update(secret, "utf8").digest("hex");
}

/** The user behind a session: from the short-lived cache, or one query (then cached). */
async function sessionUser(userId: string): Promise<CachedUser | undefined> {
  const { users } = actorCaches();
  const cached = users.get(userId);
  if (cached) return cached;
  const generation = users.mark();
  noteRequestStat("actorQueries");
  const row = await getUserById(getDb(), { id: userId });
  if (!row) return undefined;
  const user: CachedUser = { id: row.id, email: row.email, name: row.name, role: row.role, disabled: Boolean(row.disabledAt), sessionEpoch: row.sessionEpoch };
  users.set(userId, user, { userId, generation });
  return user;
}

/**
 * The session's user, checked against the database (through a cache that PostgreSQL clears
 * on every change of role, state or sessions) so a disabled user or a changed role takes
 * effect at once. Resolved once per request: the layout, the page and the actions of one
 * request share the answer (React `cache`).
 */
export const getSessionActor = cache(async (): Promise<Actor | null> => {
  // Per-request by nature: never prerendered at build time.
  await connection();
  noteRequestStat("sessionLookups");
  const session = await getServerSession(authOptions());
  const sessionUserClaims = session?.user as { id?: string; epoch?: number } | undefined;
  if (!sessionUserClaims?.id) return null;
  const user = await sessionUser(sessionUserClaims.id);
  // A session signed before the user was disabled stays dead even after re-enabling.
  if (!user || user.disabled || user.sessionEpoch !== (sessionUserClaims.epoch ?? 0)) return null;
  return { userId: user.id, email: user.email, name: user.name, role: user.role, via: "session" };
});

const LAST_USED_RESOLUTION_MS = 60_000;

/** A bearer token's user, or null when the token is unknown, revoked, expired or its user disabled. */
export async function getTokenActor(authorization: string): Promise<Actor | null> {
  const m = /^Bearer\s+(\S{10,200})$/i.exec(authorization.trim());
  if (!m?.[1]) return null;
  const tokenHash = hashToken(m[1]);
  const { tokens } = actorCaches();
  let found = tokens.get(tokenHash);
  if (!found) {
    const generation = tokens.mark();
    noteRequestStat("actorQueries");
    const row = await findTokenActor(getDb(), { tokenHash });
    if (!row) return null;
    found = { tokenId: row.tokenId, userId: row.user.id, email: row.user.email, name: row.user.name, role: row.user.role, lastUsedMs: row.lastUsedAt?.getTime() ?? 0 };
    // Never past the token's own expiry.
    tokens.set(tokenHash, found, { userId: row.user.id, generation, notAfterMs: row.expiresAt.getTime() });
  }
  // Last use is kept to the minute: one write a minute per token at most, none in between.
  if (Date.now() - found.lastUsedMs > LAST_USED_RESOLUTION_MS) {
    found.lastUsedMs = Date.now();
    noteRequestStat("actorQueries");
    await touchToken(getDb(), { id: found.tokenId });
  }
  return { userId: found.userId, email: found.email, name: found.name, role: found.role, via: "token", tokenId: found.tokenId };
}

export function auditActor(actor: Actor, requestId?: string): AuditActor {
  return { userId: actor.userId, label: actor.via === "token" ? `${actor.email} (API token)` : actor.email, requestId };
}
