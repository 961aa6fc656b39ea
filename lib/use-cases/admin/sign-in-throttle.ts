import "server-only";
import { getDb } from "@/db/client";
import { recordAudit, type AuditActor } from "@/db/audit";
import { clearAccountThrottle, listThrottled } from "@/db/throttle";
import { WINDOW_MINUTES } from "@/lib/auth/throttle";

/** Who is being slowed down at sign-in right now, for the admin's security screen. */
export async function signInThrottleView() {
  const { accounts, addresses } = await listThrottled(getDb());
  return { accounts, addresses, windowMinutes: WINDOW_MINUTES };
}

/**
 * An admin forgets an account's failed sign-ins from every client (after confirming with the
 * owner that the guesses were theirs); the change and how many records went are audited.
 */
export async function unlockAccount(actor: AuditActor, { email }: { email: string }): Promise<{ cleared: number }> {
  return getDb().transaction(async (tx) => {
    const cleared = await clearAccountThrottle(tx, { email });
    await recordAudit(tx, actor, { action: "sign_in.unlock", entityType: "account", entityId: email.toLowerCase(), after: { cleared } });
    return { cleared };
  });
}
