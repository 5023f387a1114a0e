import { and, eq, inArray } from "drizzle-orm";
import type { Database } from "@/db/client";
import { robustnessRuns } from "@/db/schema";
import type { RatingSpec } from "@/lib/engine";
import type { RobustnessPayload } from "@/lib/jobs/queues";
import type { UncertainInput } from "@/lib/schemas/robustness";
import { rateRobustness } from "@/lib/robustness/train";
import type { NetworkTrain } from "@/lib/robustness/network-monte-carlo";
import { isNetworkTrain, rateNetworkRobustness } from "@/lib/robustness/network-train";

interface StoredRequest {
  uncertain: UncertainInput[];
  target: number;
  samples: number;
  seed: number;
  /** A one-reaction train, or a train of several reactions (kind "network"). */
  train: RatingSpec | NetworkTrain;
}

/**
 * Runs one queued robustness run: queued → running → succeeded (or failed with the engine's message).
 * Safe to repeat: a run already finished is left alone.
 */
export async function runRobustnessJob(db: Database, payload: RobustnessPayload): Promise<{ status: string }> {
  const [run] = await db
    .update(robustnessRuns)
    .set({ status: "running" })
    .where(and(eq(robustnessRuns.id, payload.runId), inArray(robustnessRuns.status, ["queued", "running"])))
    .returning();
  if (!run) return { status: "skipped" };
  const req = run.request as unknown as StoredRequest;
  try {
    const asked = { uncertain: req.uncertain, samples: req.samples, seed: req.seed };
    const result = isNetworkTrain(req.train) ? rateNetworkRobustness(req.train, asked) : rateRobustness(req.train, { ...asked, target: req.target });
    await db
      .update(robustnessRuns)
      .set({ status: "succeeded", result: result as unknown as Record<string, unknown>, finishedAt: new Date() })
      .where(eq(robustnessRuns.id, run.id));
    return { status: "succeeded" };
  } catch (err) {
    await markRobustnessFailed(db, run.id, err instanceof Error ? err.message : String(err));
    return { status: "failed" };
  }
}

export async function markRobustnessFailed(db: Database, runId: string, message: string): Promise<void> {
  await db
    .update(robustnessRuns)
    .set({ status: "failed", error: message, finishedAt: new Date() })
    .where(and(eq(robustnessRuns.id, runId), inArray(robustnessRuns.status, ["queued", "running"])));
}
