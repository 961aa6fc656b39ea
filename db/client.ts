import "server-only";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import * as schema from "./schema";
import { env } from "@/lib/server/env";
import { noteRequestStat } from "./request-stats";

export type Database = NodePgDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** Either the database or an open transaction: query functions accept both. */
export type Executor = Database | Tx;

const globalForDb = globalThis as unknown as { loopkeeperPool?: Pool; loopkeeperDb?: Database; loopkeeperCloseHooks?: Set<() => Promise<void>> };

function makePool(): Pool {
  const pool = new Pool({
    connectionString: env().DATABASE_URL,
    max: env().DB_POOL_MAX,
    connectionTimeoutMillis: 3000,
    idleTimeoutMillis: 30_000,
    statement_timeout: 15_000,
  });
  // An idle client losing its server must not crash the process; the next query reconnects.
  pool.on("error", (err) => console.error(JSON.stringify({ level: "error", msg: "pg pool error", err: err.message })));
  return pool;
}

/** The shared Drizzle database. One pool per process; the dev server's reloads reuse it. */
export function getDb(): Database {
  if (!globalForDb.loopkeeperDb) {
    globalForDb.loopkeeperPool = makePool();
    globalForDb.loopkeeperDb = drizzle(globalForDb.loopkeeperPool, {
      schema,
      // Counts statements per request when a counter is open (tests, LOOPKEEPER_REQUEST_STATS).
      logger: { logQuery: () => noteRequestStat("queries") },
    });
  }
  return globalForDb.loopkeeperDb;
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
  const pool = globalForDb.loopkeeperPool;
  globalForDb.loopkeeperPool = undefined;
  globalForDb.loopkeeperDb = undefined;
  await pool?.end();
}
