import type PgBoss from "pg-boss";
import { z } from "zod";

/** Queue names (kebab-case) and their payload schemas: checked on send and on receipt. */
export const QUEUES = {
  /** Round trip through the queue; used by health checks and tests of the worker's wiring. */
  systemPing: "system-ping",
  /** A few consecutive scenarios of one sweep. */
  sweepChunk: "sweep-chunk",
  /** Chunks that failed every retry end here; their sweep is marked failed. */
  sweepChunkDead: "sweep-chunk-dead",
  /** One Monte Carlo rating too large to run inside its request. */
  robustness: "robustness",
  /** Robustness jobs that failed every retry (or whose worker died on the last one) end here; their run is marked failed. */
  robustnessDead: "robustness-dead",
} as const;

/** Postgres NOTIFY channel that wakes idle workers when jobs are queued. */
export const WAKE_CHANNEL = "seriatim_jobs";

export const systemPingPayload = z.object({ sentAt: z.iso.datetime() });
export type SystemPingPayload = z.infer<typeof systemPingPayload>;

export const sweepChunkPayload = z.strictObject({
  sweepId: z.uuid(),
  /** Scenario indexes from (inclusive) to (exclusive). */
  from: z.int().min(0),
  to: z.int().min(1),
});
export type SweepChunkPayload = z.infer<typeof sweepChunkPayload>;

export const robustnessPayload = z.strictObject({ runId: z.uuid() });
export type RobustnessPayload = z.infer<typeof robustnessPayload>;

/** Queue settings, from the environment so tests can shorten the expiry of a killed worker's job. */
export function sweepQueueOptions(): PgBoss.Queue {
  return {
    name: QUEUES.sweepChunk,
    retryLimit: Number(process.env.SWEEP_JOB_RETRY_LIMIT ?? 3),
    retryDelay: Number(process.env.SWEEP_JOB_RETRY_DELAY_SECONDS ?? 1),
    expireInSeconds: Number(process.env.SWEEP_JOB_EXPIRE_SECONDS ?? 120),
    deadLetter: QUEUES.sweepChunkDead,
  };
}

/**
 * 100,000 samples of a slow train take minutes; a dead worker's run is retried once after expiry.
 * A job that fails its last attempt is copied by pg-boss into the dead-letter queue.
 */
export function robustnessQueueOptions(): PgBoss.Queue {
  return { name: QUEUES.robustness, retryLimit: 1, retryDelay: 1, expireInSeconds: 15 * 60, deadLetter: QUEUES.robustnessDead };
}

/** Creates every queue (idempotent); both the app and the worker call it on start. */
export async function ensureQueues(boss: PgBoss): Promise<void> {
  // The web app and each worker create the queues as they start; on a new database two of
  // them doing it at once can deadlock in PostgreSQL (40P01). The loser simply tries again.
  for (let attempt = 1; ; attempt++) {
    try {
      return await createQueues(boss);
    } catch (err) {
      if ((err as { code?: string }).code !== "40P01" || attempt >= 5) throw err;
      await new Promise((r) => setTimeout(r, 100 * attempt));
    }
  }
}

async function createQueues(boss: PgBoss): Promise<void> {
  await boss.createQueue(QUEUES.systemPing);
  await boss.createQueue(QUEUES.sweepChunkDead);
  await boss.createQueue(QUEUES.sweepChunk, sweepQueueOptions());
  await boss.createQueue(QUEUES.robustnessDead);
  await boss.createQueue(QUEUES.robustness, robustnessQueueOptions());
  // createQueue leaves an existing queue as it is: a database made before the dead-letter queue
  // existed gets it here.
  await boss.updateQueue(QUEUES.robustness, robustnessQueueOptions());
}
