import "server-only";
import { inArray, sql } from "drizzle-orm";
import { signInAttempts } from "./schema";
import type { Executor } from "./client";

export const MAX_FAILURES = 5;
export const WINDOW_MINUTES = 15;
export const LOCK_MINUTES = 15;

/** Seconds until the earliest of these keys may try again, or 0 when none is locked. */
export async function secondsLocked(db: Executor, { keys }: { keys: string[] }): Promise<number> {
  const rows = await db
    .select({ wait: sql<number>`greatest(0, extract(epoch from (${signInAttempts.lockedUntil} - now())))::int` })
    .from(signInAttempts)
    .where(inArray(signInAttempts.key, keys));
  return rows.reduce((m, r) => Math.max(m, Number(r.wait) || 0), 0);
}

/** Counts one failure per key in a fixed window; the maxFailures-th failure locks the key for a while. */
export async function recordFailure(db: Executor, { keys, maxFailures = MAX_FAILURES }: { keys: string[]; maxFailures?: number }): Promise<void> {
  for (const key of keys) {
    await db.execute(sql`
      insert into sign_in_attempts (key, failures, window_started_at, updated_at)
      values (${key}, 1, now(), now())
      on conflict (key) do update set
        failures = case when sign_in_attempts.window_started_at < now() - make_interval(mins => ${WINDOW_MINUTES})
                        then 1 else sign_in_attempts.failures + 1 end,
        window_started_at = case when sign_in_attempts.window_started_at < now() - make_interval(mins => ${WINDOW_MINUTES})
                        then now() else sign_in_attempts.window_started_at end,
        locked_until = case when (case when sign_in_attempts.window_started_at < now() - make_interval(mins => ${WINDOW_MINUTES})
                        then 1 else sign_in_attempts.failures + 1 end) >= ${maxFailures}
                        then now() + make_interval(mins => ${LOCK_MINUTES}) else sign_in_attempts.locked_until end,
        updated_at = now()`);
  }
}

export async function clearFailures(db: Executor, { keys }: { keys: string[] }): Promise<void> {
  await db.delete(signInAttempts).where(inArray(signInAttempts.key, keys));
}
