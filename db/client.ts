import "server-only";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import * as schema from "./schema";
import { env } from "@/lib/platform/env";

export type Database = NodePgDatabase<typeof schema>;
export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
/** Either the database or an open transaction: query functions accept both. */
export type Executor = Database | Tx;

const globalForDb = globalThis as unknown as { loopkeeperPool?: Pool; loopkeeperDb?: Database };

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
    globalForDb.loopkeeperDb = drizzle(globalForDb.loopkeeperPool, { schema });
  }
  return globalForDb.loopkeeperDb;
}

export async function closeDb(): Promise<void> {
  const pool = globalForDb.loopkeeperPool;
  globalForDb.loopkeeperPool = undefined;
  globalForDb.loopkeeperDb = undefined;
  await pool?.end();
}
