import PgBoss from "pg-boss";
import type pg from "pg";
import { getEnv } from "@/lib/env";
import { ensureQueues } from "./queues";

const globalForBoss = globalThis as unknown as { seriatimBoss?: Promise<PgBoss> };

/**
 * The app's own pg-boss handle, for sending and cancelling only: no maintenance or
 * scheduling here (the workers do that).
 */
export function getBoss(): Promise<PgBoss> {
  if (!globalForBoss.seriatimBoss) {
    const starting = (async () => {
      const boss = new PgBoss({ connectionString: getEnv().DATABASE_URL, supervise: false, schedule: false, max: 3, application_name: "seriatim-web" });
      // Logged, never fatal: pg-boss re-makes its connections after a database restart.
      boss.on("error", (err) => console.error("pg-boss (web) error", err.message));
      await boss.start();
      await ensureQueues(boss);
      return boss;
    })();
    // A start that failed (database down) is not kept: the next request tries again.
    starting.catch(() => {
      if (globalForBoss.seriatimBoss === starting) globalForBoss.seriatimBoss = undefined;
    });
    globalForBoss.seriatimBoss = starting;
  }
  return globalForBoss.seriatimBoss;
}

/** pg-boss's executor over a client inside our transaction, so jobs and rows commit together. */
export function bossDbFor(client: pg.PoolClient): PgBoss.Db {
  return { executeSql: (text, values) => client.query(text, values) };
}
