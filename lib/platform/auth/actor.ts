import "server-only";
import { createHash } from "node:crypto";
import { getServerSession } from "next-auth";
import { connection } from "next/server";
import { cache } from "react";
import { getDb } from "@/db/client";
import { getSessionUser } from "@/db/sessions";
import { noteRequestStat } from "@/db/request-stats";
import { findTokenActor, touchToken } from "@/db/tokens";
import type { AuditActor } from "@/db/audit";
import type { Role } from "@/lib/auth/roles";
import { actorCaches } from "./actor-cache";
import { authOptions } from "@/lib/platform/auth/options";

/** Who is making this request, as the server established it. */
export interface Actor {
  userId: string;
  email: string;
  name: string;
  role: Role;
  via: "session" | "token";
  tokenId?: string;
  /** For browser sessions: the server-side session record (ended by sign-out or a password change). */
  sessionId?: string;
}

export function hashToken(secret: string): string {
  return createHash("sha256").update(secret, "utf8").digest("hex");
}

/**
 * The session's user, checked against the database with its server-side session record, so
 * sign-out, a password change, a disabled user or a changed role take effect at once. Resolved once per request: the layout, the page and the actions of one
 * request share the answer (React `cache`).
 */
export const getSessionActor = cache(async (): Promise<Actor | null> => {
  // Per-request by nature: never prerendered at build time.
  await connection();
  noteRequestStat("sessionLookups");
  const session = await getServerSession(authOptions());
  const claims = session?.user as { id?: string; epoch?: number; sid?: string } | undefined;
  if (!claims?.id || !claims.sid) return null;
  // The session must still be live on the server: signed-out and superseded sessions are
  // refused. One query, not cached: ending a session must take effect at its next request.
  noteRequestStat("actorQueries");
  const row = await getSessionUser(getDb(), { sessionId: claims.sid, userId: claims.id });
  // A session signed before the user was disabled stays dead even after re-enabling.
  if (!row || row.disabledAt || row.sessionEpoch !== (claims.epoch ?? 0)) return null;
  return { userId: row.id, email: row.email, name: row.name, role: row.role, via: "session", sessionId: claims.sid };
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
