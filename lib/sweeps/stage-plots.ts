import { stagePlots, type DesignSpec, type StagePlot } from "@/lib/engine";
import { engineSpecOf } from "@/lib/costs/candidate-costing";
import { applyOverrides } from "./grid";
import type { StoredStage } from "./stored-json";

/**
 * A one-reaction candidate's plot data: as stored by sweeps computed before plot points stopped being
 * stored, otherwise recomputed from its stages and its scenario's chemistry (the sweep's spec with the
 * scenario's values). Recomputing costs about 25 rate evaluations a stage; storing them cost about
 * 2.5 kB a candidate.
 */
export function candidatePlots(stored: unknown, stages: readonly StoredStage[], baseSpec: Record<string, unknown>, overrides: Record<string, number>): StagePlot[] {
  if (Array.isArray(stored) && stored.length === stages.length && stored.length > 0) return stored as StagePlot[];
  return stagePlots(scenarioDesignSpec(baseSpec, overrides), stages);
}

/** The spec a one-reaction scenario was designed with: the sweep's spec (without its costing) with the scenario's values. */
export function scenarioDesignSpec(baseSpec: Record<string, unknown>, overrides: Record<string, number>): DesignSpec {
  return applyOverrides(engineSpecOf(baseSpec), overrides) as unknown as DesignSpec;
}
