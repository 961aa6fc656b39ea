/**
 * The sign-in throttle policy: slow down the client that guesses, never lock the owner out.
 *
 * Failures are counted in a sliding 15-minute window under three keys:
 * - the account and client pair: after two free mistakes each further failure doubles the
 *   wait before that client may try that account again (2 s, 4 s, 8 s … capped at 15 min);
 * - the account: past `ACCOUNT_CAP` failures from anywhere, only clients with no recent
 *   failure on it are heard, so the owner on their own device still signs in with the right
 *   password while a guessing client gets nothing;
 * - the client address: past `ADDRESS_CAP` failures across accounts (credential stuffing),
 *   that address waits out the window. The address comes from the socket (see
 *   lib/platform/http/client-address.ts), so one client cannot share its bucket with everybody.
 * Changing the password runs through the same throttle.
 */

export const WINDOW_MINUTES = 15;
/** Failures from one client on one account that cost no wait (typos happen). */
export const FREE_FAILURES = 2;
export const MAX_DELAY_SEC = 15 * 60;
/** Failures on one account from all clients, in a window, before only fresh clients are heard. */
export const ACCOUNT_CAP = 20;
/** Failures from one client address across all accounts, in a window, before it waits. */
export const ADDRESS_CAP = 100;

/** Seconds a client waits after its n-th failure on one account within the window. */
export function pairDelaySec(failures: number): number {
  if (failures <= FREE_FAILURES) return 0;
  return Math.min(MAX_DELAY_SEC, 2 ** (failures - FREE_FAILURES));
}

export interface ThrottleState {
  /** Failures of this client on this account in the window. */
  pairFailures: number;
  /** Seconds until this client may try this account again. */
  pairWaitSec: number;
  /** Failures on this account from all clients in the window. */
  accountFailures: number;
  /** Failures from this client address across all accounts in the window. */
  addressFailures: number;
  /** Seconds until the window of this address ends. */
  addressWaitSec: number;
}

export type ThrottleDecision = { allowed: true } | { allowed: false; retryAfterSec: number; reason: "pair_delay" | "account_cap" | "address_cap" };

/** Whether this attempt is heard at all; the password is checked only when it is. */
export function decideAttempt(s: ThrottleState): ThrottleDecision {
  if (s.pairWaitSec > 0) return { allowed: false, retryAfterSec: s.pairWaitSec, reason: "pair_delay" };
  if (s.addressFailures >= ADDRESS_CAP) return { allowed: false, retryAfterSec: Math.max(1, s.addressWaitSec), reason: "address_cap" };
  // The owner's fresh device is still heard; a client that already guessed wrong is not.
  if (s.accountFailures >= ACCOUNT_CAP && s.pairFailures > 0) return { allowed: false, retryAfterSec: WINDOW_MINUTES * 60, reason: "account_cap" };
  return { allowed: true };
}
