import "server-only";
import { sql } from "drizzle-orm";
import type { Executor } from "./client";

export interface RateLimitCount {
  key: string;
  windowStartMs: number;
  count: number;
}

/**
 * Adds batched request counts to their fixed windows, in PostgreSQL so every app instance
 * shares them, and returns each window's new total. One statement for the whole batch.
 */
export async function addRateLimitCounts(db: Executor, increments: RateLimitCount[]): Promise<RateLimitCount[]> {
  if (!increments.length) return [];
  const keys = increments.map((i) => i.key);
  const windows = increments.map((i) => new Date(i.windowStartMs).toISOString());
  const counts = increments.map((i) => i.count);
  const res = await db.execute<{ key: string; window_ms: string | number; count: number }>(sql`
    insert into rate_limits (key, window_start, count)
    select k, w, c from unnest(${sql.param(keys)}::text[], ${sql.param(windows)}::timestamptz[], ${sql.param(counts)}::int[]) as t(k, w, c)
    on conflict (key, window_start) do update set count = rate_limits.count + excluded.count
    returning key, (extract(epoch from window_start) * 1000)::bigint as window_ms, count`);
  return res.rows.map((r) => ({ key: r.key, windowStartMs: Number(r.window_ms), count: Number(r.count) }));
}

/** Drops windows older than an hour; called now and then, not on every request. */
export async function pruneRateLimits(db: Executor): Promise<void> {
  await db.execute(sql`delete from rate_limits where window_start < now() - interval '1 hour'`);
}
