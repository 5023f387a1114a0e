import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "./schema";
import { getEnv } from "@/lib/env";

export type Database = NodePgDatabase<typeof schema>;

// One pool per process; Next's dev server re-evaluates modules, so keep it on globalThis.
const globalForDb = globalThis as unknown as { seriatimPool?: pg.Pool; seriatimDb?: Database };

export function getPool(): pg.Pool {
  globalForDb.seriatimPool ??= new pg.Pool({ connectionString: getEnv().DATABASE_URL, max: 10 });
  return globalForDb.seriatimPool;
}

export function getDb(): Database {
  globalForDb.seriatimDb ??= drizzle(getPool(), { schema });
  return globalForDb.seriatimDb;
}

/** A transaction handle or the database itself: query helpers accept either. */
export type Executor = Database | Parameters<Parameters<Database["transaction"]>[0]>[0];

export async function closeDb(): Promise<void> {
  await globalForDb.seriatimPool?.end();
  globalForDb.seriatimPool = undefined;
  globalForDb.seriatimDb = undefined;
}
