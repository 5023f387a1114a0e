import type { TrainStageType } from "@/lib/engine";
import { sequenceKey } from "@/lib/stage-types";

/**
 * The candidate columns both kinds of sweep fill the same way (one reaction and several): where the
 * row belongs, the train as a key, its rank and stage count, and its volume beside the single tube's.
 */
export function commonCandidateColumns(
  sweepId: string,
  scenarioId: string,
  c: { sequence: readonly string[]; rank: number; feasible: boolean; totalVolume: number | null },
  singlePfrVolume: number | null,
) {
  return {
    sweepId,
    scenarioId,
    sequenceKey: sequenceKey(c.sequence as readonly TrainStageType[]),
    rank: c.rank,
    stageCount: c.sequence.length,
    feasible: c.feasible,
    totalVolume: c.totalVolume,
    // A single tube of zero volume (nothing to do) or none at all gives no ratio rather than an infinite one.
    ratioToPfr: c.totalVolume !== null && singlePfrVolume !== null && singlePfrVolume > 0 ? c.totalVolume / singlePfrVolume : null,
  };
}
