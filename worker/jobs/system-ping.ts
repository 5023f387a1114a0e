import type PgBoss from "pg-boss";
import { QUEUES, systemPingPayload } from "@/lib/jobs/queues";

export async function registerSystemPing(boss: PgBoss): Promise<void> {
  await boss.work(QUEUES.systemPing, async ([job]) => {
    const payload = systemPingPayload.parse(job.data);
    return { receivedAt: new Date().toISOString(), sentAt: payload.sentAt, worker: process.pid };
  });
}
