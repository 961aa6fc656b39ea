import "server-only";
import { and, desc, eq, gt, isNull, sql } from "drizzle-orm";
import { apiTokens, users, type ApiToken, type User } from "./schema";
import type { Database, Executor } from "./client";
import { recordAudit, type AuditActor } from "./audit";
import { AppError } from "@/lib/api/errors";

export type PublicToken = Omit<ApiToken, "tokenHash">;

function toPublic({ tokenHash: _h, ...rest }: ApiToken): PublicToken {
  return rest;
}

export async function listTokens(db: Executor, { userId }: { userId: string }): Promise<PublicToken[]> {
  const rows = await db.select().from(apiTokens).where(eq(apiTokens.userId, userId)).orderBy(desc(apiTokens.createdAt));
  return rows.map(toPublic);
}

export async function createToken(
  db: Database,
  actor: AuditActor,
  input: { userId: string; name: string; tokenHash: string; tokenPrefix: string; expiresAt: Date },
): Promise<PublicToken> {
  return db.transaction(async (tx) => {
    const [row] = await tx.insert(apiTokens).values(input).returning();
    if (!row) throw new AppError("internal", "Token was not created.");
    await recordAudit(tx, actor, { action: "token.create", entityType: "api_token", entityId: row.id, after: toPublic(row) });
    return toPublic(row);
  });
}

export async function revokeToken(db: Database, actor: AuditActor, { id, userId }: { id: string; userId: string }): Promise<PublicToken> {
  return db.transaction(async (tx) => {
    const [current] = await tx.select().from(apiTokens).where(eq(apiTokens.id, id)).for("update");
    if (!current) throw new AppError("not_found", "No such token.");
    if (current.userId !== userId) throw new AppError("forbidden", "That token belongs to someone else.");
    if (current.revokedAt) return toPublic(current);
    const [row] = await tx.update(apiTokens).set({ revokedAt: new Date() }).where(eq(apiTokens.id, id)).returning();
    if (!row) throw new AppError("internal", "Token was not revoked.");
    await recordAudit(tx, actor, { action: "token.revoke", entityType: "api_token", entityId: id, before: toPublic(current), after: toPublic(row) });
    return toPublic(row);
  });
}

/** The live token with this hash and its user, or nothing when revoked, expired or the user is disabled. */
export async function findActiveToken(db: Executor, { tokenHash }: { tokenHash: string }): Promise<{ token: ApiToken; user: User } | undefined> {
  const [row] = await db
    .select({ token: apiTokens, user: users })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, tokenHash), isNull(apiTokens.revokedAt), gt(apiTokens.expiresAt, sql`now()`), isNull(users.disabledAt)))
    .limit(1);
  return row;
}

export interface TokenActorRow {
  tokenId: string;
  lastUsedAt: Date | null;
  expiresAt: Date;
  user: Pick<User, "id" | "email" | "name" | "role">;
}

// The API's hot path: prepared once per database handle under a fixed name, so each
// connection plans it once.
function buildTokenActor(db: Database) {
  return db
    .select({
      tokenId: apiTokens.id,
      lastUsedAt: apiTokens.lastUsedAt,
      expiresAt: apiTokens.expiresAt,
      user: { id: users.id, email: users.email, name: users.name, role: users.role },
    })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(and(eq(apiTokens.tokenHash, sql.placeholder("tokenHash")), isNull(apiTokens.revokedAt), gt(apiTokens.expiresAt, sql`now()`), isNull(users.disabledAt)))
    .limit(1)
    .prepare("auth_token_actor");
}

const prepared = new WeakMap<Database, ReturnType<typeof buildTokenActor>>();

/** The live token with this hash and the fields of its user a request needs; undefined when revoked, expired or the user is disabled. */
export async function findTokenActor(db: Database, { tokenHash }: { tokenHash: string }): Promise<TokenActorRow | undefined> {
  let statement = prepared.get(db);
  if (!statement) {
    statement = buildTokenActor(db);
    prepared.set(db, statement);
  }
  const [row] = await statement.execute({ tokenHash });
  return row;
}

/** Records use, at most once a minute per token so hot clients do not write on every call. */
export async function touchToken(db: Executor, { id }: { id: string }): Promise<void> {
  await db
    .update(apiTokens)
    .set({ lastUsedAt: sql`now()` })
    .where(and(eq(apiTokens.id, id), sql`(${apiTokens.lastUsedAt} is null or ${apiTokens.lastUsedAt} < now() - interval '1 minute')`));
}
