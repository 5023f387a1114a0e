import PgBoss from "pg-boss";
import pg from "pg";
import { createDb } from "@/db/client";
import { ensureQueues, WAKE_CHANNEL } from "@/lib/jobs/queues";
import { registerRobustness } from "./jobs/robustness";
import { registerSweepChunk, type WorkerState } from "./jobs/sweep-chunk";
import { registerSystemPing } from "./jobs/system-ping";

export interface RunningWorker {
  boss: PgBoss;
  state: WorkerState;
  stop(opts?: { graceful?: boolean; timeoutMs?: number }): Promise<void>;
}

/** Starts pg-boss on the given database and registers every queue handler. */
export async function startWorker(databaseUrl: string, log: (msg: string, extra?: unknown) => void = console.log): Promise<RunningWorker> {
  const boss = new PgBoss({
    connectionString: databaseUrl,
    application_name: "seriatim-worker",
    // How soon a dead worker's job is noticed after its expiry.
    maintenanceIntervalSeconds: Number(process.env.QUEUE_MAINTENANCE_SECONDS ?? 30),
  });
  boss.on("error", (err) => log("pg-boss error", err));
  await boss.start();
  await ensureQueues(boss);
  const pool = new pg.Pool({ connectionString: databaseUrl, max: 3, application_name: "seriatim-worker-db" });
  const state: WorkerState = { stopping: false };
  await registerSystemPing(boss);
  const sweepWorker = await registerSweepChunk(boss, createDb(pool), state, log);
  const robustnessWorker = await registerRobustness(boss, createDb(pool), log);

  // Wake at once when the app queues jobs, instead of waiting for the next poll.
  const listener = new pg.Client({ connectionString: databaseUrl, application_name: "seriatim-worker-listen" });
  await listener.connect();
  listener.on("notification", () => {
    boss.notifyWorker(sweepWorker);
    boss.notifyWorker(robustnessWorker);
  });
  listener.on("error", (err) => log("listener error", err));
  await listener.query(`LISTEN ${WAKE_CHANNEL}`);

  return {
    boss,
    state,
    async stop({ graceful = true, timeoutMs = 20_000 } = {}) {
      state.stopping = true;
      await listener.end().catch(() => {});
      await boss.stop({ graceful, timeout: timeoutMs, wait: true });
      await pool.end();
    },
  };
}
