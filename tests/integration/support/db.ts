import { inArray, isNull, and, sql } from "drizzle-orm";
import { getDb, closeDb as closePool } from "@/db/client";
import { getUserByEmail } from "@/db/users";
import { apiTokens } from "@/db/schema";
import type { AuditActor } from "@/db/audit";

export { getDb };

/** Tokens a test file made for demo accounts; revoked when it closes, so runs never fill a user's live-token cap. */
export const tokensToRevoke: string[] = [];

export async function closeDb(): Promise<void> {
  if (tokensToRevoke.length) {
    await getDb()
      .update(apiTokens)
      .set({ revokedAt: sql`now()` })
      .where(and(inArray(apiTokens.id, tokensToRevoke.splice(0)), isNull(apiTokens.revokedAt)))
      .catch(() => undefined);
  }
  await closePool();
}

/** The audit actor of a seeded demo account, for calling db/ functions directly. */
export async function demoActor(email: string): Promise<AuditActor & { userId: string }> {
  const user = await getUserByEmail(getDb(), { email });
  if (!user) throw new Error(`demo user ${email} is not seeded`);
  return { userId: user.id, label: email };
}
