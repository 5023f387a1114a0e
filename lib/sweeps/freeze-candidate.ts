import type { Candidate, Scenario, Sweep } from "@/db/schema";
import type { StagePlot, StageType } from "@/lib/engine";
import type { TrainPlan } from "@/lib/costs/train-plan";
import type { PinnedCandidate, ScenarioReference, StoredStage } from "./stored-json";

/** The frozen copy of a candidate that a pinned design keeps: totals, stages with plot data, its scenario and sweep. */
export function freezeCandidate(c: Candidate, scenario: Pick<Scenario, "index" | "overrides" | "reference">, sweep: Pick<Sweep, "id" | "name">): PinnedCandidate {
  return {
    rank: c.rank,
    sequence: c.sequenceKey.split("-") as StageType[],
    feasible: c.feasible,
    totalVolume: c.totalVolume,
    totalCost: c.totalCost,
    ratioToPfr: c.ratioToPfr,
    // Costing and uncertainty as ranked, so the pin keeps them even if its sweep is deleted.
    installedCost: c.installedCost,
    inventoryPlan: c.inventoryPlan as TrainPlan | null,
    probabilityMeet: c.probabilityMeet,
    stages: c.stages.map((s, i) => ({ ...(s as unknown as StoredStage), levenspiel: c.levenspiel[i] as StagePlot })),
    scenario: { index: scenario.index, overrides: scenario.overrides, reference: scenario.reference as ScenarioReference | null },
    sweep: { id: sweep.id, name: sweep.name },
  };
}
