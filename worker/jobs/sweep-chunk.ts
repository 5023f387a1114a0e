import type PgBoss from "pg-boss";
import type { Database } from "@/db/client";
import { QUEUES, sweepChunkPayload } from "@/lib/jobs/queues";
import { markSweepFailed, runSweepChunk } from "@/lib/services/sweep-chunks";

export interface WorkerState {
  stopping: boolean;
}

/**
 * One chunk per job. A throw fails the job and pg-boss retries it (a killed worker's job
 * comes back after its expiry); the attempt that has no retry left marks the sweep failed.
 */
export async function registerSweepChunk(boss: PgBoss, db: Database, state: WorkerState, log: (m: string, x?: unknown) => void): Promise<string> {
  await boss.work(QUEUES.sweepChunkDead, async ([job]) => {
    const payload = sweepChunkPayload.safeParse(job.data);
    if (payload.success) await markSweepFailed(db, payload.data.sweepId, "A part of this sweep failed on every attempt; see the worker log");
  });
  let workerId = "";
  workerId = await boss.work(QUEUES.sweepChunk, { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: 0.5 }, async ([job]) => {
    // pg-boss waits out its polling interval after every job; a finished chunk means more
    // may be waiting, so ask for the next one at once.
    if (workerId) setImmediate(() => boss.notifyWorker(workerId));
    const parsed = sweepChunkPayload.safeParse(job.data);
    if (!parsed.success) {
      // A retry cannot fix a malformed payload, but pg-boss still retries every failed job up
      // to the queue's retryLimit; only when the last attempt fails is the job marked failed
      // and a copy of its payload sent to the dead-letter queue (whose handler cannot name a
      // sweep from it either, so nothing else changes).
      log(`job ${job.id}: invalid payload`, parsed.error.issues);
      throw new Error("invalid sweep-chunk payload");
    }
    try {
      const report = await runSweepChunk(db, parsed.data, () => state.stopping);
      if (state.stopping && report.computed < parsed.data.to - parsed.data.from) {
        // Stopped between scenarios: hand the rest back to the queue.
        throw new Error("worker stopping; chunk released for another worker");
      }
      return { ...report, worker: process.pid };
    } catch (err) {
      // Drizzle wraps driver errors; the cause holds what PostgreSQL said.
      const cause = err instanceof Error && err.cause instanceof Error ? `: ${err.cause.message}` : "";
      const message = err instanceof Error ? `${err.message.split("\n")[0]}${cause}` : String(err);
      log(`queue ${QUEUES.sweepChunk} job ${job.id} (sweep ${parsed.data.sweepId}, attempt ${job.retryCount + 1}/${job.retryLimit + 1}): ${message}`);
      if (job.retryCount >= job.retryLimit && !state.stopping) await markSweepFailed(db, parsed.data.sweepId, message);
      throw err;
    }
  });
  return workerId;
}
