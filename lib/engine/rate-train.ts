import { CAUTIONS } from "./cautions";
import { ensure } from "./errors";
import { checkRateMagnitude, MAX_RATED_VESSEL } from "./magnitude";
import { inletTemperature } from "./sizing-basis";
import { cstrSteadyStates, pfrOutlet, recycleSteadyStates } from "./rating";
import { ensureFixedTemperatures, resolveSizingBasis } from "./resolve-sizing-basis";
import { stageTemperature } from "./sizing-basis";
import type { RatedStage, RatingResult, RatingSpec } from "./types";
import { DIM, toSI } from "./units";

/**
 * A rated stage's recycle ratio: required for a tube with recycle (the design reports it for each such
 * stage), refused for the other types.
 * @throws EngineError at the stage's recycleRatio.
 */
export function stageRatio(s: RatingSpec["stages"][number], k: number): number | undefined {
  const path = `stages.${k}.recycleRatio`;
  if (s.type !== "PFR-recycle") {
    ensure(s.recycleRatio === undefined, "only a tube with recycle has a recycle ratio", path);
    return undefined;
  }
  ensure(s.recycleRatio !== undefined, "give the recycle ratio of the tube with recycle", path);
  ensure(Number.isFinite(s.recycleRatio) && s.recycleRatio >= 0, "the recycle ratio must be a number >= 0", path);
  return s.recycleRatio;
}

/**
 * Rates a given train: the outlet conversion of each stage from its volume. A CSTR reports every steady
 * state; the train continues from the one of lowest conversion.
 * @throws EngineError for an invalid spec.
 */
export function rateTrain(spec: RatingSpec): RatingResult {
  const { basis } = resolveSizingBasis(spec.feed, spec.reaction);
  ensureFixedTemperatures(basis, spec.reaction);
  ensure(spec.stages.length >= 1 && spec.stages.length <= 8, "give 1..8 stages", "stages");
  checkRateMagnitude(basis, basis.upper * (1 - 1e-9), spec.reaction.rate.law === "expression" ? "reaction.rate.expression" : "reaction.rate");
  let a = 0;
  const stages: RatedStage[] = spec.stages.map((s, k) => {
    const volume = toSI(s.volume, DIM.volume, `stages.${k}.volume`);
    ensure(volume >= 0, "a stage volume must be >= 0", `stages.${k}.volume`);
    // A typing slip of a few orders of magnitude must not be rated as if it were a vessel.
    ensure(volume <= MAX_RATED_VESSEL, `a stage volume must be at most ${MAX_RATED_VESSEL.toExponential(0).replace("e+", "e")} m3 (1 km3)`, `stages.${k}.volume`);
    const first = k === 0;
    const ratio = stageRatio(s, k);
    const states =
      s.type === "CSTR"
        ? cstrSteadyStates(basis, first, a, volume)
        : s.type === "PFR-recycle"
          ? recycleSteadyStates(basis, first, a, volume, ratio as number)
          : [{ conversionOut: pfrOutlet(basis, first, a, volume), temperatureOut: 0 }].map((st) => ({
              ...st,
              temperatureOut: stageTemperature(basis, first, a, st.conversionOut),
            }));
    const stage: RatedStage = {
      type: s.type,
      volume,
      ...(ratio !== undefined ? { recycleRatio: ratio } : {}),
      conversionIn: a,
      temperatureIn: inletTemperature(basis, first, a),
      steadyStates: states,
      multiple: states.length > 1,
      conversionOut: states[0].conversionOut,
      temperatureOut: states[0].temperatureOut,
    };
    a = stage.conversionOut;
    return stage;
  });
  return { stages, conversionOut: a, cautions: [...CAUTIONS] };
}
