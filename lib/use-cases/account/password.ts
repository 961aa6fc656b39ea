import "server-only";
import type { Database } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { endOtherSessions } from "@/db/sessions";
import { revokeAllTokens } from "@/db/tokens";
import { setPasswordHash } from "@/db/users";
import { AppError } from "@/lib/api/errors";
import type { Actor } from "@/lib/platform/auth/actor";
import { isCommon } from "@/lib/platform/auth/common-passwords";
import { hashPassword } from "@/lib/platform/auth/password";
import { checkCredentials } from "@/lib/platform/auth/sign-in";

/**
 * A new password ends every other session of the user (the one making the change stays) and,
 * when asked, revokes all their API tokens; one transaction with its audit event.
 */
export async function changePasswordEndingSessions(
  db: Database,
  actor: AuditActor,
  { id, passwordHash, keepSessionId, revokeTokens }: { id: string; passwordHash: string; keepSessionId?: string; revokeTokens: boolean },
): Promise<{ otherSessionsEnded: number; tokensRevoked: number }> {
  return db.transaction(async (tx) => {
    if (!(await setPasswordHash(tx, { id, passwordHash }))) throw new AppError("not_found", "No such user.");
    const otherSessionsEnded = await endOtherSessions(tx, { userId: id, keepSessionId });
    const tokensRevoked = revokeTokens ? await revokeAllTokens(tx, { userId: id }) : 0;
    await recordAudit(tx, actor, { action: "user.password_change", entityType: "user", entityId: id, after: { otherSessionsEnded, tokensRevoked } });
    return { otherSessionsEnded, tokensRevoked };
  });
}

/**
 * A signed-in person changes their password. Only in a browser session: an API token (a
 * machine's credential) cannot (403). The new one must not be common or breached (422); the
 * current one is checked through the sign-in throttle, so this form cannot be used to guess it (422).
 */
export async function changePassword(
  db: Database,
  actor: Actor,
  audit: AuditActor,
  input: { currentPassword: string; newPassword: string; revokeTokens: boolean; client: string },
) {
  if (actor.via !== "session" || !actor.sessionId) throw new AppError("forbidden", "Change your password while signed in to the app; API tokens cannot change it.");
  if (isCommon(input.newPassword)) {
    throw new AppError("validation_failed", "This password is on a list of common or breached passwords; choose another.", {
      issues: [{ path: "/newPassword", message: "On the list of common or breached passwords." }],
    });
  }
  const check = await checkCredentials({ email: actor.email, password: input.currentPassword, client: input.client });
  if (!check.ok) {
    throw new AppError("validation_failed", check.retryAfterSec ? `Too many wrong passwords from this device; try again in ${check.retryAfterSec} s.` : "The current password is not right.", {
      issues: [{ path: "/currentPassword", message: "Not your current password." }],
    });
  }
  return changePasswordEndingSessions(db, audit, { id: actor.userId, passwordHash: await hashPassword(input.newPassword), keepSessionId: actor.sessionId, revokeTokens: input.revokeTokens });
}
