import PgBoss from "pg-boss";
import pg from "pg";
import { createDb, survivesRestarts } from "@/db/client";
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
  // Logged, never fatal: pg-boss re-makes its connections after a database restart.
  boss.on("error", (err) => log(`queue: ${err.message}`));
  await boss.start();
  await ensureQueues(boss);
  // A database restart must not end the process: the job in hand fails and is retried.
  const pool = survivesRestarts(
    new pg.Pool({ connectionString: databaseUrl, max: 3, application_name: "seriatim-worker-db", connectionTimeoutMillis: 10_000 }),
    (m) => log(`database: ${m}`),
  );
  const state: WorkerState = { stopping: false };
  await registerSystemPing(boss);
  const sweepWorker = await registerSweepChunk(boss, createDb(pool), state, log);
  const robustnessWorker = await registerRobustness(boss, createDb(pool), log);

  // Wake at once when the app queues jobs, instead of waiting for the next poll. The LISTEN
  // connection is re-made (with back-off) when the server goes away; polling covers the gap.
  const wake = () => {
    boss.notifyWorker(sweepWorker);
    boss.notifyWorker(robustnessWorker);
  };
  const listener = listenWithReconnect(databaseUrl, wake, log, () => state.stopping);
  await listener.ready;

  return {
    boss,
    state,
    async stop({ graceful = true, timeoutMs = 20_000 } = {}) {
      state.stopping = true;
      await listener.close();
      await boss.stop({ graceful, timeout: timeoutMs, wait: true });
      await pool.end();
    },
  };
}

/** A LISTEN client on WAKE_CHANNEL that reconnects after errors until `stopped()`. */
function listenWithReconnect(databaseUrl: string, onWake: () => void, log: (msg: string) => void, stopped: () => boolean) {
  let client: pg.Client | undefined;
  let delayMs = 500;
  let timer: NodeJS.Timeout | undefined;
  const connect = async (): Promise<void> => {
    const c = new pg.Client({ connectionString: databaseUrl, application_name: "seriatim-worker-listen", connectionTimeoutMillis: 10_000 });
    client = c;
    let lost = false;
    const reconnect = (why: string) => {
      if (lost || stopped()) return;
      lost = true;
      log(`wake-up connection lost (${why}); reconnecting in ${(delayMs / 1000).toFixed(1)} s`);
      c.end().catch(() => {});
      timer = setTimeout(() => void connect().catch(() => {}), delayMs);
      delayMs = Math.min(delayMs * 2, 10_000);
    };
    c.on("error", (err) => reconnect(err.message));
    c.on("end", () => reconnect("connection closed"));
    c.on("notification", onWake);
    try {
      await c.connect();
      await c.query(`LISTEN ${WAKE_CHANNEL}`);
      delayMs = 500;
      // Jobs queued while we were away were not announced; look for them now.
      onWake();
    } catch (err) {
      reconnect(err instanceof Error ? err.message : String(err));
      throw err;
    }
  };
  return {
    ready: connect(),
    async close() {
      clearTimeout(timer);
      await client?.end().catch(() => {});
    },
  };
}
