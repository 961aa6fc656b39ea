import "server-only";
import type { Database } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import type { Role, User } from "@/db/schema";
import { revokeAllTokens } from "@/db/tokens";
import { getUserByEmail, insertUser, lockUser, toPublicUser, updateUserRow, type PublicUser } from "@/db/users";
import { AppError } from "@/lib/api/errors";
import { userChangeActions } from "@/lib/audit/describe";
import { isCommon } from "@/lib/platform/auth/common-passwords";
import { hashPassword } from "@/lib/platform/auth/password";

/** Creates an account with an already hashed password, audited, in one transaction; an e-mail already in use is refused (409). */
export async function createUser(db: Database, actor: AuditActor, input: { email: string; name: string; role: Role; passwordHash: string }): Promise<PublicUser> {
  return db.transaction(async (tx) => {
    if (await getUserByEmail(tx, { email: input.email })) throw new AppError("conflict", `A user with the e-mail ${input.email} already exists.`);
    const after = toPublicUser(await insertUser(tx, input));
    await recordAudit(tx, actor, { action: "user.create", entityType: "user", entityId: after.id, after });
    return after;
  });
}

/** An administrator adds a person with a first password, which must not be a common or breached one (422). */
export async function addUser(db: Database, actor: AuditActor, { password, ...input }: { email: string; name: string; role: Role; password: string }) {
  if (isCommon(password)) {
    throw new AppError("validation_failed", "This first password is on a list of common or breached passwords; choose another.", {
      issues: [{ path: "/password", message: "On the list of common or breached passwords." }],
    });
  }
  return { user: await createUser(db, actor, { ...input, passwordHash: await hashPassword(password) }) };
}

/**
 * Changes a person's role, or disables or re-enables the account, in one transaction with one
 * audit event per kind of change. Nobody disables themselves or drops their own admin role
 * (409). Disabling ends the person's sessions at their next request and revokes their API
 * tokens, so re-enabling does not revive them.
 */
export async function updateUser(db: Database, actor: AuditActor, { id, role, disabled }: { id: string; role?: Role; disabled?: boolean }): Promise<PublicUser> {
  return db.transaction(async (tx) => {
    const current = await lockUser(tx, { id });
    if (!current) throw new AppError("not_found", "No such user.");
    if (actor.userId === id && (disabled === true || (role && role !== "admin"))) {
      throw new AppError("conflict", "You cannot disable yourself or remove your own admin role; ask another admin.");
    }
    const patch: Partial<User> = { updatedAt: new Date() };
    if (role) patch.role = role;
    let tokensRevoked = 0;
    if (disabled === true && !current.disabledAt) {
      patch.disabledAt = new Date();
      // Sessions signed before this moment stop working at their next request.
      patch.sessionEpoch = current.sessionEpoch + 1;
      // Tokens are revoked, not merely blocked while disabled, so re-enabling does not revive them.
      tokensRevoked = await revokeAllTokens(tx, { userId: id });
    }
    if (disabled === false) patch.disabledAt = null;
    const row = await updateUserRow(tx, { id, patch });
    // One event per kind of change (role change, disable, re-enable), so the log tells them apart.
    const actions = userChangeActions(current, row);
    for (const action of actions.length ? actions : ["user.update"]) {
      await recordAudit(tx, actor, { action, entityType: "user", entityId: id, before: toPublicUser(current), after: { ...toPublicUser(row), ...(tokensRevoked ? { tokensRevoked } : {}) } });
    }
    return toPublicUser(row);
  });
}
