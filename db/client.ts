import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { Pool } from "pg";
import { databaseSettings } from "./settings";
import * as schema from "./schema";

export type Database = NodePgDatabase<typeof schema>;
/** A transaction handle has the same query surface as the database. */
export type Tx = Parameters<Parameters<Database["transaction"]>[0]>[0];
export type Db = Database | Tx;

const globalForDb = globalThis as unknown as { rlPool?: Pool; rlDb?: Database };

/**
 * The pool's settings, each bounding how long a request can wait on PostgreSQL:
 *  - a pooled connection within PG_CONNECT_TIMEOUT_MS (pg's default waits for ever);
 *  - a statement within PG_STATEMENT_TIMEOUT_MS, enforced by the server (statement_timeout) and,
 *    for a server that stops answering altogether (frozen, cut off), by the client (query_timeout);
 *  - a transaction left idle (its request gone) is ended by the server after 30 s;
 *  - TCP keep-alive, so a dead peer is noticed on idle connections.
 * Idle connections are kept for 5 minutes (pg's default is 10 s), so a crew's next burst of uploads
 * finds them open; they never keep a script's process alive (allowExitOnIdle).
 */
export function poolOptions(connectionString: string) {
  const e = databaseSettings();
  return {
    connectionString,
    max: 10,
    idleTimeoutMillis: 5 * 60_000,
    allowExitOnIdle: true,
    connectionTimeoutMillis: e.PG_CONNECT_TIMEOUT_MS,
    statement_timeout: e.PG_STATEMENT_TIMEOUT_MS,
    query_timeout: e.PG_STATEMENT_TIMEOUT_MS + 2000,
    idle_in_transaction_session_timeout: 30_000,
    keepAlive: true,
  };
}

/**
 * A connection that breaks (PostgreSQL restarted or stopped: "terminating connection due to
 * administrator command") is an event to log, never an uncaught exception: the pool drops it and
 * the next query opens a new one (or fails with 503 while the server is away).
 */
function watch(pool: Pool): Pool {
  pool.on("error", (err) => warnLost("database connection lost", err));
  // A checked-out client has no pool listener while a request holds it between statements.
  pool.on("connect", (client) => client.on("error", (err) => warnLost("database connection lost while in use", err)));
  return pool;
}

/**
 * One JSON line on stderr in the shape of lib/log.ts, with the error's name, code and message only
 * (never a query's parameters, so nothing to redact), written straight to stderr as lib/log.ts
 * writes; the data layer does not import lib/.
 */
function warnLost(message: string, err: Error & { code?: unknown }): void {
  const e = { name: err.name, message: err.message, ...(typeof err.code === "string" ? { code: err.code } : {}) };
  process.stderr.write(JSON.stringify({ level: "warn", time: new Date().toISOString(), message, err: e }) + "\n");
}

/** One pool per process (survives hot reload in development). */
export function db(): Database {
  if (!globalForDb.rlDb) {
    globalForDb.rlPool = watch(new Pool(poolOptions(databaseSettings().DATABASE_URL)));
    globalForDb.rlDb = drizzle(globalForDb.rlPool, { schema });
  }
  return globalForDb.rlDb;
}

export async function closeDb(): Promise<void> {
  await globalForDb.rlPool?.end();
  globalForDb.rlPool = undefined;
  globalForDb.rlDb = undefined;
}
