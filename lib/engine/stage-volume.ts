import { optimalRecycle, recycleVolume, recycleVolumeGradient } from "./recycle";
import { chosenRange, type SizingBasis } from "./sizing-basis";
import { stageBasisAt } from "./stage-temperature";
import { bestStageGradient } from "./stage-temperature-derivatives";
import { bestStageTemperature } from "./stage-temperature-search";
import { idealStageVolume, idealStageVolumeGradient, type StagePlace } from "./stages";

/** Recycle ratio of a tube with recycle from a to b: the user's when fixed, else the one of least volume. */
export function stageRecycleRatio(basis: SizingBasis, place: StagePlace, a: number, b: number): number {
  if (place.recycleRatio !== undefined && place.recycleRatio !== null) return place.recycleRatio;
  if (chosenRange(basis, place.first)) {
    const t = bestStageTemperature(basis, place, a, b).temperature;
    return Number.isFinite(t) ? optimalRecycle(stageBasisAt(basis, t), false, a, b).ratio : 0;
  }
  return optimalRecycle(basis, place.first, a, b).ratio;
}

/** Volume of a stage of any type, m3 (at its best inlet temperature when that is chosen); Infinity when infeasible. */
export function stageVolume(basis: SizingBasis, place: StagePlace, a: number, b: number): number {
  if (chosenRange(basis, place.first)) return bestStageTemperature(basis, place, a, b).volume;
  if (place.type !== "PFR-recycle") return idealStageVolume(basis, place, a, b);
  if (place.recycleRatio !== undefined && place.recycleRatio !== null) return recycleVolume(basis, place.first, a, b, place.recycleRatio);
  return optimalRecycle(basis, place.first, a, b).volume;
}

/**
 * Partial derivatives of a stage's volume with respect to its inlet (a) and outlet (b) conversions; for a
 * tube with a chosen recycle ratio, those of the optimised volume (see recycleVolumeGradient).
 */
export function stageVolumeGradient(basis: SizingBasis, place: StagePlace, a: number, b: number, precise = true): [number, number] {
  if (chosenRange(basis, place.first)) return bestStageGradient(basis, place, a, b, precise);
  if (place.type !== "PFR-recycle") return idealStageVolumeGradient(basis, place, a, b, precise);
  return recycleVolumeGradient(basis, place.first, a, b, stageRecycleRatio(basis, place, a, b), precise);
}
