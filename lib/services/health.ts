import { sql } from "drizzle-orm";
import type { Database } from "@/db/client";

/**
 * Whether the database answers a trivial query within `waitMs`. The health route calls this so that a
 * restart of PostgreSQL shows as "unreachable" promptly instead of a request that hangs.
 */
export async function databaseReachable(db: Database, waitMs: number): Promise<boolean> {
  let timer: NodeJS.Timeout | undefined;
  const timeout = new Promise<never>((_, reject) => {
    timer = setTimeout(() => reject(new Error("database check timed out")), waitMs);
  });
  try {
    await Promise.race([db.execute(sql`select 1`), timeout]);
    return true;
  } catch {
    return false;
  } finally {
    clearTimeout(timer);
  }
}
