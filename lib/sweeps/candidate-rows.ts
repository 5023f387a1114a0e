import type { DesignResult } from "@/lib/engine";
import { commonCandidateColumns } from "./common-candidate-columns";

/** The candidate rows of one scenario's ranking, as stored: without plot points (recomputed when drawn). */
export function candidateRows(sweepId: string, scenarioId: string, result: DesignResult) {
  const pfr = result.reference.singlePFR;
  return result.candidates.map((c) => ({
    ...commonCandidateColumns(sweepId, scenarioId, c, pfr),
    totalCost: c.totalCost,
    reason: c.reason,
    // Measures of the network kind only (lib/sweeps/network-candidate-rows.ts).
    conversion: null,
    yield: null,
    selectivity: null,
    objectiveValue: null,
    onBound: null,
    stages: c.stages.map(({ levenspiel: _plot, ...stage }) => stage as unknown as Record<string, unknown>),
    // Plot points are recomputed from the stages when a chart is drawn (lib/sweeps/stage-plots.ts).
    levenspiel: [] as unknown[],
  }));
}

/**
 * The scenario's best objective as ranked: with reuse of idle vessels the cost the user will pay
 * (the least installed cost with reuse), otherwise the engine's best.
 */
export function bestObjectiveOf(result: DesignResult, rows: { feasible: boolean; installedCost: number | null; inventoryPlan: unknown }[]): number | null {
  if (result.objective === "cost" && rows.some((r) => r.inventoryPlan)) {
    const costs = rows.filter((r) => r.feasible && r.installedCost !== null).map((r) => r.installedCost as number);
    return costs.length ? Math.min(...costs) : null;
  }
  return bestObjective(result);
}

export function bestObjective(result: DesignResult): number | null {
  const best = result.candidates.find((c) => c.feasible);
  if (!best) return null;
  return result.objective === "cost" ? best.totalCost : best.totalVolume;
}
