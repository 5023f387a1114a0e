import type { NetworkDesignResult, NetworkDesignSpec } from "@/lib/engine";
import { EngineError } from "@/lib/engine";
import type { SweepRobustness } from "@/lib/schemas/robustness";
import { rateNetworkUnderUncertainty } from "./network-monte-carlo";
import { networkTrainOf } from "./network-train";

/**
 * For a sweep of several reactions that asked for robustness: the chance that each candidate of a
 * scenario meets every limit (minimum conversion and minimum yield) under the sweep's uncertain
 * inputs, in the result's candidate order; null for an infeasible candidate, or for all when the sweep
 * asked for none. Every train gets the same seed, so candidates are compared on the same draws.
 */
export function networkProbabilitiesMeet(spec: NetworkDesignSpec, result: NetworkDesignResult, robustness: SweepRobustness | null | undefined): (number | null)[] {
  if (!robustness) return result.candidates.map(() => null);
  return result.candidates.map((c) => {
    if (!c.feasible || c.stages.length === 0) return null;
    const train = networkTrainOf(spec as unknown as Record<string, unknown>, c.stages);
    try {
      return rateNetworkUnderUncertainty({ train, uncertain: robustness.uncertain, samples: robustness.samples, seed: robustness.seed }).probabilityMeet;
    } catch (err) {
      if (err instanceof EngineError) return null;
      throw err;
    }
  });
}
