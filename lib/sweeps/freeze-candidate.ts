import type { Candidate, Scenario, Sweep } from "@/db/schema";
import type { StagePlot, StageType } from "@/lib/engine";
import type { TrainPlan } from "@/lib/costs/train-plan";
import { isNetworkSpec } from "@/lib/schemas/network-spec";
import { sequenceFromKey } from "@/lib/stage-types";
import { candidatePlots } from "./stage-plots";
import type { NetworkScenarioReference, PinnedCandidate, PinnedNetworkCandidate, ScenarioReference, StoredNetworkStage, StoredStage } from "./stored-json";

/** The frozen copy of a candidate that a pinned design keeps: totals, stages with plot data, its scenario and sweep. */
export function freezeCandidate(c: Candidate, scenario: Pick<Scenario, "index" | "overrides" | "reference">, sweep: Pick<Sweep, "id" | "name"> & { baseSpec?: Sweep["baseSpec"] }): PinnedCandidate | PinnedNetworkCandidate {
  // The sweep's spec tells the kind; without it (older callers) the candidate is of one reaction.
  if (sweep.baseSpec && isNetworkSpec(sweep.baseSpec)) return freezeNetworkCandidate(c, scenario, sweep);
  return {
    rank: c.rank,
    // The key codec reads a tube with recycle back whole.
    sequence: sequenceFromKey(c.sequenceKey),
    feasible: c.feasible,
    totalVolume: c.totalVolume,
    totalCost: c.totalCost,
    ratioToPfr: c.ratioToPfr,
    // Costing and uncertainty as ranked, so the pin keeps them even if its sweep is deleted.
    installedCost: c.installedCost,
    inventoryPlan: c.inventoryPlan as TrainPlan | null,
    probabilityMeet: c.probabilityMeet,
    stages: frozenStages(c, scenario.overrides, sweep.baseSpec),
    scenario: { index: scenario.index, overrides: scenario.overrides, reference: scenario.reference as ScenarioReference | null },
    sweep: { id: sweep.id, name: sweep.name },
  };
}

/**
 * The frozen copy of a network candidate: its measures, outlet composition and stages (profiles are
 * recomputed from the stages when shown). The outlet is the last stage's; totals of residence time are
 * the stages' sum.
 */
function freezeNetworkCandidate(c: Candidate, scenario: Pick<Scenario, "index" | "overrides" | "reference">, sweep: Pick<Sweep, "id" | "name">): PinnedNetworkCandidate {
  const stages = c.stages as unknown as StoredNetworkStage[];
  return {
    kind: "network",
    rank: c.rank,
    sequence: sequenceFromKey(c.sequenceKey) as StageType[], // a network's stages are CSTR and PFR only
    feasible: c.feasible,
    totalVolume: c.totalVolume,
    totalResidenceTime: c.feasible ? stages.reduce((sum, s) => sum + s.residenceTime, 0) : null,
    conversion: c.conversion,
    yield: c.yield,
    selectivity: c.selectivity,
    objective: c.objectiveValue,
    outlet: stages.at(-1)?.outlet ?? null,
    onBound: c.onBound ?? [],
    probabilityMeet: c.probabilityMeet,
    stages,
    scenario: { index: scenario.index, overrides: scenario.overrides, reference: scenario.reference as NetworkScenarioReference | null },
    sweep: { id: sweep.id, name: sweep.name },
  };
}

/** Stages with their plot data: as stored by older sweeps, else recomputed from the scenario's chemistry. */
function frozenStages(c: Candidate, overrides: Record<string, number>, baseSpec: Sweep["baseSpec"] | undefined) {
  const stages = c.stages as unknown as StoredStage[];
  const stored = c.levenspiel as StagePlot[];
  const plots = baseSpec ? candidatePlots(stored, stages, baseSpec, overrides) : stored;
  return stages.map((s, i) => ({ ...s, levenspiel: plots[i] }));
}
