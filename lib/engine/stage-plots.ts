import { stagePlot } from "./levenspiel";
import { resolveSizingBasis } from "./resolve-sizing-basis";
import { stageBasisAt } from "./stage-temperature";
import type { FeedSpec, ReactionSpec, StagePlot, TrainStageType } from "./types";

/**
 * The Levenspiel plot data of a designed train's stages, recomputed from the stages' types and
 * conversions and the chemistry they were designed with: the same points the design returned (the
 * same functions, rounded alike), so a stored candidate need not keep them.
 * @throws EngineError when the chemistry is invalid (it was valid when the train was designed).
 */
export function stagePlots(
  chemistry: { feed: FeedSpec; reaction: ReactionSpec },
  stages: readonly { type: TrainStageType; conversionIn: number; conversionOut: number; recycleRatio?: number; temperatureIn?: number; temperatureChosen?: boolean }[],
): StagePlot[] {
  if (stages.length === 0) return [];
  const { basis } = resolveSizingBasis(chemistry.feed, chemistry.reaction);
  return stages.map((s, k) =>
    // A stage whose inlet temperature the design chose is drawn on its own path from that temperature.
    s.temperatureChosen && s.temperatureIn !== undefined
      ? stagePlot(stageBasisAt(basis, s.temperatureIn), s.type, false, s.conversionIn, s.conversionOut, s.recycleRatio)
      : stagePlot(basis, s.type, k === 0, s.conversionIn, s.conversionOut, s.recycleRatio),
  );
}
