import { and, eq } from "drizzle-orm";
import type { Executor } from "@/db/client";
import { candidates, scenarios, sweeps } from "@/db/schema";

/** A candidate of one team with its scenario and sweep, or null (also for another team's id). */
export async function teamCandidateWithScenario(db: Executor, teamId: string, candidateId: string) {
  const [row] = await db
    .select({ candidate: candidates, scenario: scenarios, sweep: sweeps })
    .from(candidates)
    .innerJoin(scenarios, eq(scenarios.id, candidates.scenarioId))
    .innerJoin(sweeps, eq(sweeps.id, candidates.sweepId))
    .where(and(eq(candidates.id, candidateId), eq(sweeps.teamId, teamId)));
  return row ?? null;
}
