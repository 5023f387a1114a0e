import { sql } from "drizzle-orm";
import type { Database } from "@/db/client";

/** One round trip to the database; rejects while it cannot be reached. */
export async function pingDatabase(db: Database): Promise<void> {
  await db.execute(sql`select 1`);
}
