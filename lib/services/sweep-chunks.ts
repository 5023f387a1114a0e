import { and, eq, gte, inArray, lt, sql } from "drizzle-orm";
import type { Database } from "@/db/client";
import { candidates, scenarios, sweeps, users, type Sweep } from "@/db/schema";
import { designNetwork, designTrains, EngineError, type DesignResult, type DesignSpec, type NetworkDesignResult, type NetworkDesignSpec } from "@/lib/engine";
import { bestObjectiveOf, candidateRows } from "@/lib/sweeps/candidate-rows";
import { bestNetworkObjective, networkCandidateRows, networkScenarioReference } from "@/lib/sweeps/network-candidate-rows";
import { isNetworkSpec } from "@/lib/schemas/network-spec";
import type { Executor } from "@/db/client";
import type { SweepChunkPayload } from "@/lib/jobs/queues";
import { appLink, sendMail } from "@/lib/mail";
import { engineSpecOf, withCosting } from "@/lib/costs/candidate-costing";
import { probabilitiesMeet } from "@/lib/robustness/sweep-ranking";
import type { SweepRobustness } from "@/lib/schemas/robustness";
import { applyOverrides } from "@/lib/sweeps/grid";

type Outcome =
  | { scenarioId: string; result: DesignResult; meet: (number | null)[] }
  | { scenarioId: string; network: NetworkDesignResult; spec: NetworkDesignSpec }
  | { scenarioId: string; error: { message: string; path: string | null; code: string } };

/** What a scenario's row records once it has been computed. */
type ScenarioDone = { status: "succeeded"; bestObjective: number | null; reference: Record<string, unknown>; candidateCount: number; computedAt: Date } | { status: "failed"; error: { message: string; path: string | null; code: string }; computedAt: Date };

const ACTIVE = ["queued", "running"] as const;

/** Thrown inside the write transaction to roll it back when the sweep was cancelled or failed meanwhile. */
class SweepNotActive extends Error {
  constructor(readonly status: string) {
    super(`sweep is ${status}`);
  }
}

export interface ChunkReport {
  computed: number;
  written: number;
  skipped?: string;
  finished?: Sweep["status"];
}

/**
 * Runs the scenarios [from, to) of a sweep and stores their candidates. Safe to repeat:
 * candidates are unique per (sweep, scenario, sequence) and a scenario counts towards
 * progress only on its first transition out of "pending", so a retried job never
 * duplicates or loses a candidate. An engine refusal is recorded on its scenario.
 */
export async function runSweepChunk(db: Database, payload: SweepChunkPayload, shouldStop: () => boolean = () => false): Promise<ChunkReport> {
  const [sweep] = await db.select().from(sweeps).where(eq(sweeps.id, payload.sweepId));
  if (!sweep) return { computed: 0, written: 0, skipped: "no such sweep" };
  if (!(ACTIVE as readonly string[]).includes(sweep.status)) return { computed: 0, written: 0, skipped: sweep.status };
  if (sweep.status === "queued") {
    await db.update(sweeps).set({ status: "running", startedAt: new Date() }).where(and(eq(sweeps.id, sweep.id), eq(sweeps.status, "queued")));
  }

  const pending = await db
    .select()
    .from(scenarios)
    .where(and(eq(scenarios.sweepId, sweep.id), gte(scenarios.index, payload.from), lt(scenarios.index, payload.to), eq(scenarios.status, "pending")))
    .orderBy(scenarios.index);

  const network = isNetworkSpec(sweep.baseSpec);
  const outcomes: Outcome[] = [];
  for (const s of pending) {
    if (shouldStop()) break;
    try {
      if (network) {
        // Robustness per train is not offered for network sweeps (createSweep refuses it), so none is rated here.
        const spec = applyOverrides(sweep.baseSpec, s.overrides) as unknown as NetworkDesignSpec;
        outcomes.push({ scenarioId: s.id, network: designNetwork(spec), spec });
        continue;
      }
      const spec = applyOverrides(engineSpecOf(sweep.baseSpec), s.overrides) as unknown as DesignSpec;
      const result = designTrains(spec);
      outcomes.push({ scenarioId: s.id, result, meet: probabilitiesMeet(spec, result, sweep.robustness as SweepRobustness | null) });
    } catch (err) {
      if (!(err instanceof EngineError)) throw err;
      outcomes.push({ scenarioId: s.id, error: { message: err.message, path: err.path || null, code: err.code } });
    }
  }
  if (outcomes.length === 0) return { computed: 0, written: 0 };

  let finished: { written: number; changed: boolean };
  try {
    finished = await db.transaction(async (tx) => {
      let transitioned = 0;
      let failed = 0;
      for (const o of outcomes) {
        const updated = await tx
          .update(scenarios)
          .set(await writeOutcome(tx, sweep, o))
          .where(and(eq(scenarios.id, o.scenarioId), eq(scenarios.status, "pending")))
          .returning({ id: scenarios.id });
        if (updated.length) {
          transitioned += 1;
          if ("error" in o) failed += 1;
        }
      }
      // Lock the sweep row last and briefly: it orders concurrent chunks' progress updates,
      // and a sweep cancelled meanwhile rolls this chunk's rows back. "No key update", because
      // the candidates' foreign keys already hold key-share locks on this row in every chunk's
      // transaction, and FOR UPDATE would deadlock against them.
      const [current] = await tx.select({ status: sweeps.status }).from(sweeps).where(eq(sweeps.id, sweep.id)).for("no key update");
      if (!current || !(ACTIVE as readonly string[]).includes(current.status)) throw new SweepNotActive(current?.status ?? "deleted");
      const [after] = await tx
        .update(sweeps)
        .set({
          done: sql`${sweeps.done} + ${transitioned}`,
          failedScenarios: sql`${sweeps.failedScenarios} + ${failed}`,
          status: sql`case when ${sweeps.done} + ${transitioned} >= ${sweeps.total} then 'succeeded'::sweep_status else ${sweeps.status} end`,
          finishedAt: sql`case when ${sweeps.done} + ${transitioned} >= ${sweeps.total} then now() else ${sweeps.finishedAt} end`,
        })
        .where(eq(sweeps.id, sweep.id))
        .returning();
      return { written: transitioned, changed: after.status === "succeeded" };
    });
  } catch (err) {
    if (err instanceof SweepNotActive) return { computed: outcomes.length, written: 0, skipped: err.status };
    throw err;
  }

  if (finished.changed) await notifySubmitter(db, sweep, "succeeded");
  return { computed: outcomes.length, written: finished.written, ...(finished.changed ? { finished: "succeeded" as const } : {}) };
}

/** Writes one scenario's candidates (none when it failed) and says what its row records. */
async function writeOutcome(tx: Executor, sweep: Sweep, o: Outcome): Promise<ScenarioDone> {
  const insert = async (rows: (typeof candidates.$inferInsert)[]) => {
    for (let i = 0; i < rows.length; i += 500) await tx.insert(candidates).values(rows.slice(i, i + 500)).onConflictDoNothing();
  };
  if ("network" in o) {
    await insert(networkCandidateRows(sweep.id, o.scenarioId, o.network));
    return { status: "succeeded", bestObjective: bestNetworkObjective(o.network), reference: { ...networkScenarioReference(o.spec, o.network) }, candidateCount: o.network.candidates.length, computedAt: new Date() };
  }
  if ("result" in o) {
    const rows = withCosting(candidateRows(sweep.id, o.scenarioId, o.result), sweep).map((r, i) => ({ ...r, probabilityMeet: o.meet[i] }));
    await insert(rows);
    return {
      status: "succeeded",
      bestObjective: bestObjectiveOf(o.result, rows),
      reference: { ...o.result.reference, equilibriumConversion: o.result.equilibriumConversion ?? null, feedVolumetricFlow: o.result.feedVolumetricFlow, objective: o.result.objective },
      candidateCount: o.result.candidates.length,
      computedAt: new Date(),
    };
  }
  return { status: "failed", error: o.error, computedAt: new Date() };
}

/** Marks a sweep failed (a chunk failed every retry); only an active sweep changes. */
export async function markSweepFailed(db: Database, sweepId: string, message: string): Promise<boolean> {
  const rows = await db
    .update(sweeps)
    .set({ status: "failed", error: message, finishedAt: new Date() })
    .where(and(eq(sweeps.id, sweepId), inArray(sweeps.status, [...ACTIVE])))
    .returning();
  if (rows.length) await notifySubmitter(db, rows[0], "failed");
  return rows.length > 0;
}

async function notifySubmitter(db: Database, sweep: Sweep, status: "succeeded" | "failed"): Promise<void> {
  const [user] = await db.select({ email: users.email, name: users.name }).from(users).where(eq(users.id, sweep.submittedBy));
  if (!user) return;
  const link = appLink(`/projects/${sweep.projectId}/sweeps/${sweep.id}`);
  const [fresh] = await db.select().from(sweeps).where(eq(sweeps.id, sweep.id));
  const lines =
    status === "succeeded"
      ? [`Your sweep "${sweep.name}" has finished: ${fresh?.total ?? sweep.total} scenarios, ${fresh?.failedScenarios ?? 0} of them could not be sized.`, "", `Ranked trains: ${link}`]
      : [`Your sweep "${sweep.name}" failed: ${fresh?.error ?? "see the sweep page"}.`, "", `Details: ${link}`];
  try {
    await sendMail({ to: user.email, subject: `Sweep ${status === "succeeded" ? "finished" : "failed"}: ${sweep.name}`, text: [...lines, "", "Results come from idealised reactor models; see the cautions on the sweep page."].join("\n") });
  } catch (err) {
    console.error("sweep mail failed", { sweepId: sweep.id, err });
  }
}
