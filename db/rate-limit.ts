import "server-only";
import { sql } from "drizzle-orm";
import type { Executor } from "./client";

/**
 * Counts one request against a fixed one-minute window for this key, in PostgreSQL so
 * every app instance shares the count. Returns the count so far and the seconds left in
 * the window.
 */
export async function hitRateLimit(db: Executor, { key }: { key: string }): Promise<{ count: number; retryAfterSec: number }> {
  const res = await db.execute<{ count: number; retry_after: number }>(sql`
    insert into rate_limits (key, window_start, count)
    values (${key}, date_trunc('minute', now()), 1)
    on conflict (key, window_start) do update set count = rate_limits.count + 1
    returning count, greatest(1, ceil(extract(epoch from (window_start + interval '1 minute' - now()))))::int as retry_after`);
  const row = res.rows[0];
  return { count: Number(row?.count ?? 0), retryAfterSec: Number(row?.retry_after ?? 60) };
}

/** Drops windows older than an hour; called now and then, not on every request. */
export async function pruneRateLimits(db: Executor): Promise<void> {
  await db.execute(sql`delete from rate_limits where window_start < now() - interval '1 hour'`);
}
