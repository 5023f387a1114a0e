import { toSI, type NetworkDesignResult, type NetworkDesignSpec } from "@/lib/engine";
import { commonCandidateColumns } from "./common-candidate-columns";
import type { NetworkScenarioReference } from "./stored-json";

/**
 * The candidate rows of one network scenario's ranking, as stored: the one-reaction columns where they
 * mean the same (total volume, ratio to the single tube), the network's measures beside them, and no
 * Levenspiel plot data (a network has no single conversion axis to draw it on).
 */
export function networkCandidateRows(sweepId: string, scenarioId: string, result: NetworkDesignResult) {
  const pfr = result.reference.singlePFR?.volume ?? null;
  return result.candidates.map((c) => ({
    ...commonCandidateColumns(sweepId, scenarioId, c, pfr),
    totalCost: null,
    reason: c.reason ?? null,
    conversion: c.conversion,
    yield: c.yield,
    selectivity: c.selectivity,
    objectiveValue: c.objective,
    onBound: c.onBound ?? [],
    stages: c.stages.map((s) => ({ ...s }) as unknown as Record<string, unknown>),
    levenspiel: [] as unknown[],
  }));
}

/** The scenario's single-stage references and what it ranked by, as the scenario row keeps them. */
export function networkScenarioReference(spec: NetworkDesignSpec, result: NetworkDesignResult): NetworkScenarioReference {
  return {
    kind: "network",
    singleCSTR: result.reference.singleCSTR,
    singlePFR: result.reference.singlePFR,
    objective: spec.objective,
    feedVolumetricFlow: toSI(spec.feed.volumetricFlow, "m^3/s", "feed.volumetricFlow"),
  };
}

/** The best feasible train's objective (yield, selectivity, or total volume in m3); the engine ranks best first. */
export function bestNetworkObjective(result: NetworkDesignResult): number | null {
  return result.candidates.find((c) => c.feasible)?.objective ?? null;
}
