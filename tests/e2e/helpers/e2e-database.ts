import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";

/**
 * Runs `fn` on the e2e database over a one-connection pool, closed afterwards: how fixtures write rows
 * straight to the database when another screen's flow would only slow the spec down.
 */
export async function withE2eDatabase<T>(fn: (db: NodePgDatabase) => Promise<T>): Promise<T> {
  const url = process.env.DATABASE_URL;
  if (!url) throw new Error("DATABASE_URL is not set; run e2e tests through `npm test -- e2e`");
  const pool = new pg.Pool({ connectionString: url, max: 1 });
  try {
    return await fn(drizzle(pool));
  } finally {
    await pool.end();
  }
}
