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
  return scenarioPlotter(baseSpec, overrides)(stored, stages);
}

/**
 * `candidatePlots` for many candidates of one scenario (a table page): the scenario's spec is
 * resolved once, when the first candidate needs its points recomputed, not once a candidate.
 */
export function scenarioPlotter(baseSpec: Record<string, unknown>, overrides: Record<string, number>): (stored: unknown, stages: readonly StoredStage[]) => StagePlot[] {
  let spec: DesignSpec | undefined;
  return (stored, stages) => {
    if (Array.isArray(stored) && stored.length === stages.length && stored.length > 0) return stored as StagePlot[];
    spec ??= scenarioDesignSpec(baseSpec, overrides);
    return stagePlots(spec, stages);
  };
}

/** The spec a one-reaction scenario was designed with: the sweep's spec (without its costing) with the scenario's values. */
export function scenarioDesignSpec(baseSpec: Record<string, unknown>, overrides: Record<string, number>): DesignSpec {
  return applyOverrides(engineSpecOf(baseSpec), overrides) as unknown as DesignSpec;
}
