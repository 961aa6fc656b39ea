import "server-only";
import { createHash } from "node:crypto";
import { getServerSession } from "next-auth";
import { connection } from "next/server";
import { getDb } from "@/db/client";
import { getUserById } from "@/db/users";
import { findActiveTokenCounting, touchToken } from "@/db/tokens";
import type { AuditActor } from "@/db/audit";
import type { Role } from "@/lib/auth/roles";
import { authOptions } from "@/lib/platform/auth/options";

/** Who is making this request, as the server established it. */
export interface Actor {
  userId: string;
  email: string;
  name: string;
  role: Role;
  via: "session" | "token";
  tokenId?: string;
  /** For tokens: this request already counted against the rate limit (same round trip as the lookup). */
  rate?: { count: number; retryAfterSec: number };
}

export function hashToken(secret: string): string {
  return createHash("sha256").update(secret, "utf8").digest("hex");
}

/** The session's user, reloaded from the database so a disabled user or a changed role takes effect at once. */
export async function getSessionActor(): Promise<Actor | null> {
  // Per-request by nature: never prerendered at build time.
  await connection();
  const session = await getServerSession(authOptions());
  const user = session?.user as { id?: string; epoch?: number } | undefined;
  if (!user?.id) return null;
  const row = await getUserById(getDb(), { id: user.id });
  // A session signed before the user was disabled stays dead even after re-enabling.
  if (!row || row.disabledAt || row.sessionEpoch !== (user.epoch ?? 0)) return null;
  return { userId: row.id, email: row.email, name: row.name, role: row.role, via: "session" };
}

/** A bearer token's user, or null when the token is unknown, revoked, expired or its user disabled. */
export async function getTokenActor(authorization: string): Promise<Actor | null> {
  const m = /^Bearer\s+(\S{10,200})$/i.exec(authorization.trim());
  if (!m?.[1]) return null;
  const db = getDb();
  const found = await findActiveTokenCounting(db, { tokenHash: hashToken(m[1]) });
  if (!found) return null;
  // Last use is kept to the minute: skip the round trip while the stored time is recent.
  const lastUsedMs = found.lastUsedAt?.getTime() ?? 0;
  if (Date.now() - lastUsedMs > 60_000) await touchToken(db, { id: found.tokenId });
  const { user } = found;
  return { userId: user.id, email: user.email, name: user.name, role: user.role, via: "token", tokenId: found.tokenId, rate: found.rate };
}

export function auditActor(actor: Actor, requestId?: string): AuditActor {
  return { userId: actor.userId, label: actor.via === "token" ? `${actor.email} (API token)` : actor.email, requestId };
}
