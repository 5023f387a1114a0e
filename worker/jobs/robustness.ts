import type PgBoss from "pg-boss";
import type { Database } from "@/db/client";
import { QUEUES, robustnessPayload } from "@/lib/jobs/queues";
import { markRobustnessFailed, runRobustnessJob } from "@/lib/services/robustness-jobs";

/**
 * One Monte Carlo run per job. A run the engine refuses ends failed at once (a retry would refuse it
 * again); a crash is retried by pg-boss and the last attempt marks the run failed. A job whose last
 * attempt failed, or expired because its worker died, is copied into the dead-letter queue, whose
 * handler marks the run failed (a run already finished stays as it is).
 */
export async function registerRobustness(boss: PgBoss, db: Database, log: (m: string, x?: unknown) => void): Promise<string> {
  await boss.work(QUEUES.robustnessDead, async ([job]) => {
    const payload = robustnessPayload.safeParse(job.data);
    if (payload.success) await markRobustnessFailed(db, payload.data.runId, "The robustness check failed on every attempt; see the worker log");
    else log(`queue ${QUEUES.robustnessDead} job ${job.id}: invalid payload, nothing to mark failed`);
  });
  return boss.work(QUEUES.robustness, { includeMetadata: true, batchSize: 1, pollingIntervalSeconds: 0.5 }, async ([job]) => {
    const parsed = robustnessPayload.safeParse(job.data);
    if (!parsed.success) {
      log(`job ${job.id}: invalid payload`, parsed.error.issues);
      throw new Error("invalid robustness payload");
    }
    try {
      return { ...(await runRobustnessJob(db, parsed.data)), worker: process.pid };
    } catch (err) {
      const message = err instanceof Error ? err.message.split("\n")[0] : String(err);
      log(`queue ${QUEUES.robustness} job ${job.id} (run ${parsed.data.runId}, attempt ${job.retryCount + 1}/${job.retryLimit + 1}): ${message}`);
      if (job.retryCount >= job.retryLimit) await markRobustnessFailed(db, parsed.data.runId, message);
      throw err;
    }
  });
}
