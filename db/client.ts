import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "./schema";
import { getEnv } from "@/lib/env";

/** A Drizzle handle with every table; `$client` is the pool (or client) it runs on. */
export type Database = NodePgDatabase<typeof schema> & { $client: pg.Pool | pg.PoolClient };

/** A Drizzle handle with every table, over a pool or client the caller owns. */
export function createDb(client: pg.Pool | pg.PoolClient): Database {
  return drizzle(client, { schema }) as Database;
}

// One pool per process; Next's dev server re-evaluates modules, so keep it on globalThis.
const globalForDb = globalThis as unknown as { seriatimPool?: pg.Pool; seriatimDb?: Database };

export function getPool(): pg.Pool {
  if (!globalForDb.seriatimPool) {
    // A connection timeout, so that while the server is down or restarting requests fail
    // fast (the health route answers 503) instead of queueing without end.
    const pool = new pg.Pool({ connectionString: getEnv().DATABASE_URL, max: 10, connectionTimeoutMillis: 5_000 });
    globalForDb.seriatimPool = survivesRestarts(pool, (m) => console.error(`database pool: ${m}`));
  }
  return globalForDb.seriatimPool;
}

export function getDb(): Database {
  globalForDb.seriatimDb ??= createDb(getPool());
  return globalForDb.seriatimDb;
}

/**
 * A connection the server closes (restart, failover) must not crash the process. The pool
 * handles idle connections with its 'error' event; a connection checked out between two
 * queries (inside a transaction) has no listener of its own, so every new one gets one.
 * Its next query then fails, the transaction rolls back, and the pool replaces it.
 */
export function survivesRestarts(pool: pg.Pool, log: (msg: string) => void): pg.Pool {
  pool.on("error", (err) => log(`idle connection lost: ${err.message}`));
  pool.on("connect", (client) => client.on("error", (err) => log(`connection lost: ${err.message}`)));
  return pool;
}

/** A transaction handle or the database itself: query helpers accept either. */
export type Executor = Database | Parameters<Parameters<Database["transaction"]>[0]>[0];

export async function closeDb(): Promise<void> {
  await globalForDb.seriatimPool?.end();
  globalForDb.seriatimPool = undefined;
  globalForDb.seriatimDb = undefined;
}

/**
 * A transaction on the connection under the given handle, handing out both a Drizzle handle and
 * the raw client (for libraries such as pg-boss that must write inside the same transaction).
 * A handle over a pool lends one of its clients for the transaction; a handle over a single
 * client runs it on that client, which stays the caller's.
 */
export async function withTransaction<T>(db: Database, fn: (tx: Database, client: pg.PoolClient) => Promise<T>): Promise<T> {
  const owner = db.$client;
  const lent = owner instanceof pg.Pool;
  const client = lent ? await owner.connect() : owner;
  // A connection that cannot even roll back is broken: it goes, instead of back into the pool.
  let broken = false;
  try {
    await client.query("BEGIN");
    const result = await fn(createDb(client), client);
    await client.query("COMMIT");
    return result;
  } catch (err) {
    await client.query("ROLLBACK").catch(() => {
      broken = true;
    });
    throw err;
  } finally {
    if (lent) (client as pg.PoolClient).release(broken);
  }
}
