import type { ChildProcess } from "node:child_process";
import { closeDb } from "@/db/client";
import { getBoss } from "@/lib/jobs/boss";
import type { TestDatabase } from "../../helpers/test-db";
import { FAST_RECOVERY_ENV, stopWorkerProcess } from "../../helpers/worker-process";
import { seededTestDatabase } from "./demo-team";

/**
 * A seeded throwaway database that this process's own services and queue use too: they read
 * DATABASE_URL, as the API does, so jobs they enqueue land where the worker processes look.
 */
export async function seededQueueDatabase(): Promise<TestDatabase> {
  const t = await seededTestDatabase();
  process.env.DATABASE_URL = t.url;
  Object.assign(process.env, FAST_RECOVERY_ENV);
  return t;
}

/** For afterEach: kills the worker processes a test started and empties the list. */
export async function killWorkers(workers: ChildProcess[]): Promise<void> {
  await Promise.all(workers.splice(0).map((w) => stopWorkerProcess(w, "SIGKILL")));
}

/** For afterAll: stops this process's queue and pool, then drops the database. */
export async function closeQueueDatabase(t: TestDatabase): Promise<void> {
  await (await getBoss()).stop({ graceful: false, wait: true });
  await closeDb();
  await t.drop();
}
