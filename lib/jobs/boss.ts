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
  globalForBoss.seriatimBoss ??= (async () => {
    const boss = new PgBoss({ connectionString: getEnv().DATABASE_URL, supervise: false, schedule: false, max: 3, application_name: "seriatim-web" });
    boss.on("error", (err) => console.error("pg-boss (web) error", err));
    await boss.start();
    await ensureQueues(boss);
    return boss;
  })();
  return globalForBoss.seriatimBoss;
}

/** pg-boss's executor over a client inside our transaction, so jobs and rows commit together. */
export function bossDbFor(client: pg.PoolClient): PgBoss.Db {
  return { executeSql: (text, values) => client.query(text, values) };
}
