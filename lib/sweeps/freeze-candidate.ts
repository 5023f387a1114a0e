import type { Candidate, Scenario, Sweep } from "@/db/schema";

/** The frozen copy of a candidate that a pinned design keeps: totals, stages with plot data, its scenario and sweep. */
export function freezeCandidate(c: Candidate, scenario: Pick<Scenario, "index" | "overrides" | "reference">, sweep: Pick<Sweep, "id" | "name">) {
  return {
    rank: c.rank,
    sequence: c.sequenceKey.split("-"),
    feasible: c.feasible,
    totalVolume: c.totalVolume,
    totalCost: c.totalCost,
    ratioToPfr: c.ratioToPfr,
    // Costing and uncertainty as ranked, so the pin keeps them even if its sweep is deleted.
    installedCost: c.installedCost,
    inventoryPlan: c.inventoryPlan,
    probabilityMeet: c.probabilityMeet,
    stages: c.stages.map((s, i) => ({ ...s, levenspiel: c.levenspiel[i] })),
    scenario: { index: scenario.index, overrides: scenario.overrides, reference: scenario.reference },
    sweep: { id: sweep.id, name: sweep.name },
  };
}
