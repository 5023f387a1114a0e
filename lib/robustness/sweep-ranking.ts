import type { DesignResult, DesignSpec } from "@/lib/engine";
import { EngineError } from "@/lib/engine";
import type { SweepRobustness } from "@/lib/schemas/robustness";
import { rateUnderUncertainty } from "./monte-carlo";
import { trainSpec } from "./train";

/**
 * Probability that each candidate of a scenario meets the scenario's target under the sweep's
 * uncertain inputs (1 − the Monte Carlo probability of missing it), in the result's candidate
 * order; null for an infeasible candidate, or for all when the sweep asked for no robustness.
 * Every train gets the same seed, so candidates are compared on the same draws.
 */
export function probabilitiesMeet(spec: DesignSpec, result: DesignResult, robustness: SweepRobustness | null | undefined): (number | null)[] {
  if (!robustness) return result.candidates.map(() => null);
  return result.candidates.map((c) => {
    if (!c.feasible || c.stages.length === 0) return null;
    const train = trainSpec(spec, c.stages as unknown as Record<string, unknown>[]);
    try {
      const r = rateUnderUncertainty({ spec: train, uncertain: robustness.uncertain, target: spec.target.conversion, samples: robustness.samples, seed: robustness.seed });
      return 1 - r.probabilityOfMissingTarget;
    } catch (err) {
      if (err instanceof EngineError) return null;
      throw err;
    }
  });
}
