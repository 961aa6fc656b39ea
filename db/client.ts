import "server-only";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import * as schema from "./schema";
import { env } from "@/lib/platform/env";
import { noteRequestStat } from "./request-stats";

export type Database = NodePgDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** Either the database or an open transaction: query functions accept both. */
export type Executor = Database | Tx;

const globalForDb = globalThis as unknown as {
  loopkeeperPool?: Pool;
  loopkeeperDb?: Database;
  loopkeeperReadPool?: Pool;
  loopkeeperReadDb?: Database;
  loopkeeperCloseHooks?: Set<() => Promise<void>>;
};

function makePool(connectionString: string): Pool {
  const pool = new Pool({
    connectionString,
    max: env().DB_POOL_MAX,
    connectionTimeoutMillis: 3000,
    idleTimeoutMillis: 30_000,
    statement_timeout: 15_000,
  });
  // An idle client losing its server must not crash the process; the next query reconnects.
  pool.on("error", (err) => console.error(JSON.stringify({ level: "error", msg: "pg pool error", err: err.message })));
  return pool;
}

function makeDb(pool: Pool): Database {
  return drizzle(pool, {
    schema,
    // Counts statements per request when a counter is open (tests, LOOPKEEPER_REQUEST_STATS).
    logger: { logQuery: () => noteRequestStat("queries") },
  });
}

/** The shared Drizzle database. One pool per process; the dev server's reloads reuse it. */
export function getDb(): Database {
  if (!globalForDb.loopkeeperDb) {
    globalForDb.loopkeeperPool = makePool(env().DATABASE_URL);
    globalForDb.loopkeeperDb = makeDb(globalForDb.loopkeeperPool);
  }
  return globalForDb.loopkeeperDb;
}

/**
 * For reads of published, immutable data that may lag the primary by a moment (the serial
 * lookup): a streaming replica when DATABASE_READ_URL is set, otherwise the primary.
 */
export function getReadDb(): Database {
  const url = env().DATABASE_READ_URL;
  if (!url) return getDb();
  if (!globalForDb.loopkeeperReadDb) {
    globalForDb.loopkeeperReadPool = makePool(url);
    globalForDb.loopkeeperReadDb = makeDb(globalForDb.loopkeeperReadPool);
  }
  return globalForDb.loopkeeperReadDb;
}

/**
 * Work to finish before the pool closes: counts still to be sent, a LISTEN connection to end.
 * Kept on globalThis so scripts/serve.mjs runs the same hooks on shutdown.
 */
export function beforeCloseDb(hook: () => Promise<void>): void {
  (globalForDb.loopkeeperCloseHooks ??= new Set()).add(hook);
}

export async function closeDb(): Promise<void> {
  const hooks = [...(globalForDb.loopkeeperCloseHooks ?? [])];
  globalForDb.loopkeeperCloseHooks?.clear();
  for (const hook of hooks) await hook().catch(() => undefined);
  const pools = [globalForDb.loopkeeperPool, globalForDb.loopkeeperReadPool];
  globalForDb.loopkeeperPool = globalForDb.loopkeeperReadPool = undefined;
  globalForDb.loopkeeperDb = globalForDb.loopkeeperReadDb = undefined;
  for (const pool of pools) await pool?.end();
}
