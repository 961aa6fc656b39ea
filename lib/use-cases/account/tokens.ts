import "server-only";
import { randomBytes } from "node:crypto";
import type { Database, Executor } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { insertToken, listAllTokens, listTokens, lockLiveTokenCount, lockToken, markTokenRevoked, type PublicToken } from "@/db/tokens";
import { AppError } from "@/lib/api/errors";
import { MAX_LIVE_TOKENS } from "@/lib/api/operations/account";
import { hashToken } from "@/lib/platform/auth/actor";

/**
 * Stores an API token (only its hash), audited, in one transaction. With `maxLive` a user
 * already holding that many live tokens is refused (409); the user row is locked so two
 * requests at once cannot both pass the cap.
 */
export async function createToken(
  db: Database,
  actor: AuditActor,
  input: { userId: string; name: string; tokenHash: string; tokenPrefix: string; expiresAt: Date },
  { maxLive }: { maxLive?: number } = {},
): Promise<PublicToken> {
  return db.transaction(async (tx) => {
    if (maxLive !== undefined && (await lockLiveTokenCount(tx, { userId: input.userId })) >= maxLive) {
      throw new AppError("conflict", `You already hold ${maxLive} live API tokens, the most allowed; revoke one you no longer use, then create the new one.`);
    }
    const token = await insertToken(tx, input);
    await recordAudit(tx, actor, { action: "token.create", entityType: "api_token", entityId: token.id, after: token });
    return token;
  });
}

/** A person makes themselves an API token: the secret is shown once, only its hash is kept, at most MAX_LIVE_TOKENS live at a time. */
export async function issueToken(db: Database, actor: AuditActor & { userId: string }, { name, expiresInDays }: { name: string; expiresInDays: number }) {
  const secret = `lk_${randomBytes(32).toString("base64url")}`;
  const token = await createToken(
    db,
    actor,
    { userId: actor.userId, name, tokenHash: hashToken(secret), tokenPrefix: secret.slice(0, 10), expiresAt: new Date(Date.now() + expiresInDays * 86_400_000) },
    { maxLive: MAX_LIVE_TOKENS },
  );
  return { token, secret };
}

/**
 * Revokes a token, audited; revoking a revoked one changes nothing. `userId` null means an
 * administrator acting on anyone's token; otherwise someone else's token gets the same 404 as
 * an unknown id, so the id tells nothing.
 */
export async function revokeToken(db: Database, actor: AuditActor, { id, userId }: { id: string; userId: string | null }): Promise<PublicToken> {
  return db.transaction(async (tx) => {
    const current = await lockToken(tx, { id });
    if (!current || (userId !== null && current.userId !== userId)) throw new AppError("not_found", "You have no token with this id.");
    if (current.revokedAt) return current;
    const row = await markTokenRevoked(tx, { id });
    await recordAudit(tx, actor, { action: "token.revoke", entityType: "api_token", entityId: id, before: current, after: row });
    return row;
  });
}

/** A person's own tokens, newest first, without their hashes. */
export async function tokensOf(db: Executor, { userId }: { userId: string }) {
  return { items: await listTokens(db, { userId }) };
}

/** Every user's tokens with whose they are, newest first (the admin view); `liveOnly` leaves out revoked and expired ones. */
export async function everyonesTokens(db: Executor, { liveOnly }: { liveOnly: boolean }) {
  return { items: await listAllTokens(db, { liveOnly }) };
}
