import "server-only";
import { getDb } from "@/db/client";
import { getUserByEmail } from "@/db/users";
import type { User } from "@/db/schema";
import { readThrottle, recordSignInFailure, recordSignInSuccess } from "@/db/throttle";
import { decideAttempt } from "@/lib/auth/throttle";
import { burnPasswordCheck, verifyPassword } from "@/lib/platform/auth/password";

export type CredentialCheck = { ok: true; user: User } | { ok: false; retryAfterSec?: number };

/**
 * Checks an e-mail and password through the sign-in throttle (lib/auth/throttle.ts): a
 * throttled client is refused without its password being looked at, every failure is
 * counted for this client, the account and the address, and success clears this client's
 * record. Sign-in and the password change both go through here.
 */
export async function checkCredentials({ email, password, client }: { email: string; password: string; client: string }): Promise<CredentialCheck> {
  const db = getDb();
  const decision = decideAttempt(await readThrottle(db, { email, client }));
  if (!decision.allowed) {
    // Same work as a real check, so a refusal does not answer faster than a wrong password.
    await burnPasswordCheck(password);
    return { ok: false, retryAfterSec: decision.retryAfterSec };
  }
  const user = await getUserByEmail(db, { email });
  const ok = user ? await verifyPassword(password, user.passwordHash) : await burnPasswordCheck(password);
  if (!user || !ok || user.disabledAt) {
    await recordSignInFailure(db, { email, client });
    return { ok: false };
  }
  await recordSignInSuccess(db, { email, client });
  return { ok: true, user };
}
