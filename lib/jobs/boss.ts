import PgBoss from "pg-boss";
import type pg from "pg";
import type { Database } from "@/db/client";
import { ensureQueues } from "./queues";

/** One started pg-boss per pool (or client), so a service reaches the queue of the database it was handed. */
const bosses = new WeakMap<pg.Pool | pg.PoolClient, Promise<PgBoss>>();

/**
 * The pg-boss handle over the same pool as the given database handle, for sending and
 * cancelling only: it opens no connection of its own and runs no maintenance or scheduling
 * (the workers do that). Starting it installs pg-boss's tables if missing and creates the queues.
 */
export function queueFor(db: Database): Promise<PgBoss> {
  const owner = db.$client;
  let starting = bosses.get(owner);
  if (!starting) {
    const executor: PgBoss.Db = { executeSql: (text, values) => owner.query(text, values) };
    starting = (async () => {
      const boss = new PgBoss({ db: executor, supervise: false, schedule: false });
      // Logged, never fatal: a lost connection fails the one request that used it.
      boss.on("error", (err) => console.error("pg-boss (web) error", err.message));
      await boss.start();
      await ensureQueues(boss);
      return boss;
    })();
    // A start that failed (database down) is not kept: the next request tries again.
    const started = starting;
    started.catch(() => {
      if (bosses.get(owner) === started) bosses.delete(owner);
    });
    bosses.set(owner, started);
  }
  return starting;
}

/** pg-boss's executor over a client inside our transaction, so jobs and rows commit together. */
export function bossDbFor(client: pg.PoolClient): PgBoss.Db {
  return { executeSql: (text, values) => client.query(text, values) };
}
