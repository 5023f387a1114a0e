import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { QUEUES } from "@/lib/jobs/queues";
import { startWorker, type RunningWorker } from "@/worker/boot";
import { createTestDatabase, type TestDatabase } from "../helpers/test-db";

let t: TestDatabase;
let worker: RunningWorker;
let client: PgBoss;

beforeAll(async () => {
  t = await createTestDatabase();
  worker = await startWorker(t.url, () => {});
  client = new PgBoss({ connectionString: t.url });
  await client.start();
});
afterAll(async () => {
  await client.stop({ graceful: false });
  await worker.stop({ graceful: false });
  await t.drop();
});

describe("the pg-boss worker", () => {
  it("takes a job from the queue and completes it with its output", async () => {
    const sentAt = new Date().toISOString();
    const id = await client.send(QUEUES.systemPing, { sentAt });
    expect(id).toBeTruthy();
    let job = await client.getJobById(QUEUES.systemPing, id!);
    for (let i = 0; i < 100 && job?.state !== "completed"; i++) {
      await new Promise((r) => setTimeout(r, 100));
      job = await client.getJobById(QUEUES.systemPing, id!);
    }
    expect(job?.state).toBe("completed");
    expect(job?.output).toMatchObject({ sentAt });
  });

  it("fails a job whose payload does not match the queue's schema", async () => {
    const id = await client.send(QUEUES.systemPing, { sentAt: "not a date" }, { retryLimit: 0 });
    let job = await client.getJobById(QUEUES.systemPing, id!);
    for (let i = 0; i < 100 && job?.state !== "failed"; i++) {
      await new Promise((r) => setTimeout(r, 100));
      job = await client.getJobById(QUEUES.systemPing, id!);
    }
    expect(job?.state).toBe("failed");
  });
});
