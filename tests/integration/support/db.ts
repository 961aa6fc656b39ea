import { getDb, closeDb } from "@/db/client";
import { getUserByEmail } from "@/db/users";
import type { AuditActor } from "@/db/audit";

export { getDb, closeDb };

/** The audit actor of a seeded demo account, for calling db/ functions directly. */
export async function demoActor(email: string): Promise<AuditActor & { userId: string }> {
  const user = await getUserByEmail(getDb(), { email });
  if (!user) throw new Error(`demo user ${email} is not seeded`);
  return { userId: user.id, label: email };
}
