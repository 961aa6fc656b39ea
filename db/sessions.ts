import "server-only";
import { and, eq, gt, isNull, ne, sql } from "drizzle-orm";
import { userSessions, users, type User } from "./schema";
import type { Executor } from "./client";

/**
 * Server-side records of browser sessions. The session cookie is a signed JWT, which alone
 * cannot be taken back; each one names a row here, and a session whose row is revoked or
 * missing is refused at its next request (sign-out, password change, admin action).
 */
export async function startSession(db: Executor, { userId, maxAgeSec }: { userId: string; maxAgeSec: number }): Promise<string> {
  const [row] = await db
    .insert(userSessions)
    .values({ userId, expiresAt: sql`now() + make_interval(secs => ${maxAgeSec})` })
    .returning({ id: userSessions.id });
  if (!row) throw new Error("session was not recorded");
  return row.id;
}

/** The user of a live session (not revoked, not expired), or nothing. */
export async function getSessionUser(db: Executor, { sessionId, userId }: { sessionId: string; userId: string }): Promise<User | undefined> {
  const [row] = await db
    .select({ user: users })
    .from(userSessions)
    .innerJoin(users, eq(users.id, userSessions.userId))
    .where(and(eq(userSessions.id, sessionId), eq(userSessions.userId, userId), isNull(userSessions.revokedAt), gt(userSessions.expiresAt, sql`now()`)))
    .limit(1);
  return row?.user;
}

/** Ends one session (sign-out). */
export async function endSession(db: Executor, { sessionId }: { sessionId: string }): Promise<void> {
  await db.update(userSessions).set({ revokedAt: sql`now()` }).where(and(eq(userSessions.id, sessionId), isNull(userSessions.revokedAt)));
}

/** Ends every live session of a user except `keepSessionId`; returns how many ended. */
export async function endOtherSessions(db: Executor, { userId, keepSessionId }: { userId: string; keepSessionId?: string }): Promise<number> {
  const rows = await db
    .update(userSessions)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(userSessions.userId, userId), isNull(userSessions.revokedAt), gt(userSessions.expiresAt, sql`now()`), keepSessionId ? ne(userSessions.id, keepSessionId) : undefined))
    .returning({ id: userSessions.id });
  return rows.length;
}

/** Drops rows of sessions that ended more than a day ago, so the table stays small. */
export async function pruneSessions(db: Executor): Promise<void> {
  await db.execute(sql`delete from user_sessions where coalesce(revoked_at, expires_at) < now() - interval '1 day'`);
}
