import "server-only";
import { AsyncLocalStorage } from "node:async_hooks";

/** What one request cost in database work, counted while it runs. */
export interface RequestStats {
  /** Statements sent through Drizzle (prepared or not). */
  queries: number;
  /** Times the signed-in session was resolved (should be once per request). */
  sessionLookups: number;
  /** Statements spent finding who the caller is (0 when the actor cache answered). */
  actorQueries: number;
}

const KEY = Symbol.for("loopkeeper.requestStats");
const globalForStats = globalThis as unknown as Record<typeof KEY, AsyncLocalStorage<RequestStats> | undefined>;

/**
 * One store per process, on globalThis under a registered symbol, so scripts/serve.mjs (which
 * opens a store around each request when LOOPKEEPER_REQUEST_STATS is set) and the bundled app
 * share it. Without an open store nothing is counted.
 */
export function requestStatsStorage(): AsyncLocalStorage<RequestStats> {
  return (globalForStats[KEY] ??= new AsyncLocalStorage<RequestStats>());
}

export function noteRequestStat(what: keyof RequestStats): void {
  const stats = requestStatsStorage().getStore();
  if (stats) stats[what]++;
}

/** Runs fn with a fresh counter and returns what it cost (tests, diagnostics). */
export async function withRequestStats<T>(fn: () => Promise<T>): Promise<{ result: T; stats: RequestStats }> {
  const stats: RequestStats = { queries: 0, sessionLookups: 0, actorQueries: 0 };
  const result = await requestStatsStorage().run(stats, fn);
  return { result, stats };
}
