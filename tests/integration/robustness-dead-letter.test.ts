import type { ChildProcess } from "node:child_process";
import { eq } from "drizzle-orm";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { pinnedDesigns, robustnessRuns } from "@/db/schema";
import type { Actor } from "@/lib/authz/policy";
import { seedDemoData } from "@/lib/demo/seed";
import { queueFor } from "@/lib/jobs/boss";
import { QUEUES } from "@/lib/jobs/queues";
import { createPinRun } from "@/lib/services/robustness";
import { actorByEmail, createTestDatabase, type TestDatabase } from "../helpers/test-db";
import { startWorkerProcess, stopWorkerProcess, waitFor } from "../helpers/worker-process";

let t: TestDatabase;
let engineer: Actor;
let pinId: string;
let worker: ChildProcess | undefined;

beforeAll(async () => {
  t = await createTestDatabase();
  await seedDemoData(t.db);
  engineer = await actorByEmail(t.db, "eli.engineer@brightwater.example");
  [{ id: pinId }] = await t.db.select({ id: pinnedDesigns.id }).from(pinnedDesigns);
}, 60_000);

afterAll(async () => {
  if (worker) await stopWorkerProcess(worker, "SIGKILL");
  await t.drop();
});

/** The jobs of one queue whose payload equals `data`, oldest first. */
async function jobsIn(queue: string, data: Record<string, unknown>) {
  const r = await t.pool.query<{ id: string; state: string; retry_count: number; retry_limit: number }>(
    "select id, state, retry_count, retry_limit from pgboss.job where name = $1 and data = $2::jsonb order by created_on",
    [queue, JSON.stringify(data)],
  );
  return r.rows;
}

describe("the robustness queue's dead-letter queue", () => {
  it("is named on the robustness queue", async () => {
    const boss = await queueFor(t.db);
    const queue = await boss.getQueue(QUEUES.robustness);
    expect(queue?.deadLetter).toBe(QUEUES.robustnessDead);
    expect(await boss.getQueue(QUEUES.robustnessDead)).not.toBeNull();
  });

  it("receives a job that keeps failing, only after its retries are spent", async () => {
    // A payload the worker cannot read fails on every attempt (no mock: the real worker's check).
    const unreadable = { runId: "not-a-run-id" };
    const boss = await queueFor(t.db);
    const jobId = await boss.send(QUEUES.robustness, unreadable);
    expect(jobId).toBeTruthy();
    worker = await startWorkerProcess(t.url);
    const [dead] = await waitFor(async () => {
      const rows = await jobsIn(QUEUES.robustnessDead, unreadable);
      return rows.length ? rows : null;
    }, 90_000, "the failed job's copy in the dead-letter queue");
    expect(dead.id).not.toBe(jobId);
    const [original] = await jobsIn(QUEUES.robustness, unreadable);
    expect(original.id).toBe(jobId);
    expect(original.state).toBe("failed");
    // pg-boss retried it up to the queue's limit before giving up (retryLimit 1: two attempts).
    expect(original.retry_limit).toBe(1);
    expect(original.retry_count).toBe(original.retry_limit);
  }, 120_000);

  it("marks a queued run failed when its job reaches the dead-letter queue", async () => {
    // No worker while the run's own job is taken away, or it would rate the run first.
    if (worker) await stopWorkerProcess(worker, "SIGKILL");
    worker = undefined;
    const run = await createPinRun(t.db, engineer, pinId, { uncertain: [{ field: "reaction.rate.k", kind: "plusMinus", fraction: 0.2 }], samples: 6000, seed: 5 });
    expect(run.status).toBe("queued");
    const boss = await queueFor(t.db);
    // The run's own job is taken out of the way, and its copy arrives as pg-boss would send it after the last attempt.
    const [{ jobId }] = await t.db.select({ jobId: robustnessRuns.jobId }).from(robustnessRuns).where(eq(robustnessRuns.id, run.id));
    await boss.cancel(QUEUES.robustness, jobId!);
    await boss.send(QUEUES.robustnessDead, { runId: run.id });
    worker = await startWorkerProcess(t.url);
    const failed = await waitFor(async () => {
      const [r] = await t.db.select().from(robustnessRuns).where(eq(robustnessRuns.id, run.id));
      return r.status === "failed" ? r : null;
    }, 60_000, "the run to be marked failed");
    expect(failed.error).toMatch(/failed on every attempt/);
    expect(failed.finishedAt).not.toBeNull();
  }, 120_000);
});
