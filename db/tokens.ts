import "server-only";
import { and, desc, eq, gt, isNull, sql } from "drizzle-orm";
import { apiTokens, users, type ApiToken, type User } from "./schema";
import type { Database, Executor } from "./client";

export type PublicToken = Omit<ApiToken, "tokenHash">;

export function toPublicToken({ tokenHash: _h, ...rest }: ApiToken): PublicToken {
  return rest;
}

export type TokenWithOwner = PublicToken & { userEmail: string; userName: string };

/** Every user's tokens, newest first, with whose they are (the admin view). */
export async function listAllTokens(db: Executor, { liveOnly = false }: { liveOnly?: boolean } = {}): Promise<TokenWithOwner[]> {
  const rows = await db
    .select({ token: apiTokens, userEmail: users.email, userName: users.name })
    .from(apiTokens)
    .innerJoin(users, eq(users.id, apiTokens.userId))
    .where(liveOnly ? and(isNull(apiTokens.revokedAt), gt(apiTokens.expiresAt, sql`now()`)) : undefined)
    .orderBy(desc(apiTokens.createdAt))
    .limit(500);
  return rows.map((r) => ({ ...toPublicToken(r.token), userEmail: r.userEmail, userName: r.userName }));
}

/** Revokes every live token of a user in the caller's transaction (disable, password change); returns how many. */
export async function revokeAllTokens(tx: Executor, { userId }: { userId: string }): Promise<number> {
  const rows = await tx
    .update(apiTokens)
    .set({ revokedAt: sql`now()` })
    .where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt)))
    .returning({ id: apiTokens.id });
  return rows.length;
}

export async function listTokens(db: Executor, { userId }: { userId: string }): Promise<PublicToken[]> {
  const rows = await db.select().from(apiTokens).where(eq(apiTokens.userId, userId)).orderBy(desc(apiTokens.createdAt));
  return rows.map(toPublicToken);
}

/**
 * How many live tokens a user holds, with the user row locked until the transaction ends, so
 * two requests at once cannot both pass a cap judged on this count.
 */
export async function lockLiveTokenCount(tx: Executor, { userId }: { userId: string }): Promise<number> {
  await tx.select({ id: users.id }).from(users).where(eq(users.id, userId)).for("update");
  const [live] = await tx
    .select({ n: sql<number>`count(*)::int` })
    .from(apiTokens)
    .where(and(eq(apiTokens.userId, userId), isNull(apiTokens.revokedAt), gt(apiTokens.expiresAt, sql`now()`)));
  return Number(live?.n ?? 0);
}

export async function insertToken(tx: Executor, input: { userId: string; name: string; tokenHash: string; tokenPrefix: string; expiresAt: Date }): Promise<PublicToken> {
  const [row] = await tx.insert(apiTokens).values(input).returning();
  if (!row) throw new Error("INSERT … RETURNING gave no row");
  return toPublicToken(row);
}

/** A token's row (without its hash), locked until the transaction ends. */
export async function lockToken(tx: Executor, { id }: { id: string }): Promise<PublicToken | undefined> {
  const [row] = await tx.select().from(apiTokens).where(eq(apiTokens.id, id)).for("update");
  return row ? toPublicToken(row) : undefined;
}

export async function markTokenRevoked(tx: Executor, { id }: { id: string }): Promise<PublicToken> {
  const [row] = await tx.update(apiTokens).set({ revokedAt: new Date() }).where(eq(apiTokens.id, id)).returning();
  if (!row) throw new Error("UPDATE … RETURNING gave no row");
  return toPublicToken(row);
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
