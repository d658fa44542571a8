import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { env } from "@/lib/env";
import * as schema from "./schema";

export type Database = NodePgDatabase<typeof schema>;
/** A transaction handle has the same query surface as the database. */
export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
export type Db = Database | Tx;

const globalForDb = globalThis as unknown as { rlPool?: Pool; rlDb?: Database };

/** One pool per process (survives hot reload in development). */
export function db(): Database {
  if (!globalForDb.rlDb) {
    // Idle connections are kept for 5 minutes (pg's default is 10 s), so a crew's next burst of
    // uploads finds them open instead of starting new PostgreSQL backends; they never keep a
    // script's process alive (allowExitOnIdle).
    globalForDb.rlPool = new Pool({ connectionString: env().DATABASE_URL, max: 10, idleTimeoutMillis: 5 * 60_000, allowExitOnIdle: true });
    // An idle connection lost with the server (a restart, an outage) must not end the process: the pool makes a new one.
    globalForDb.rlPool.on("error", () => undefined);
    globalForDb.rlDb = drizzle(globalForDb.rlPool, { schema });
  }
  return globalForDb.rlDb;
}

export async function closeDb(): Promise<void> {
  await globalForDb.rlPool?.end();
  globalForDb.rlPool = undefined;
  globalForDb.rlDb = undefined;
}
