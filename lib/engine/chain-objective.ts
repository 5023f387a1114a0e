import { purchase, vesselType, type CostModel, type Purchase } from "./cost";
import { chosenRange, type SizingBasis } from "./sizing-basis";
import type { StageTemperatureDesign } from "./stage-temperature";
import { bestStageGradient, bestStageHessian } from "./stage-temperature-derivatives";
import { bestStageTemperature, nearbyStageTemperature } from "./stage-temperature-search";
import type { ChainObjective } from "./refine";
import { stageVolume, stageVolumeGradient } from "./stage-volume";
import type { StagePlace } from "./stages";

/** Total volume as a chain objective. */
export function volumeObjective(basis: SizingBasis, places: readonly StagePlace[]): ChainObjective {
  if (basis.choice) return chosenTemperatureObjective(basis, places);
  return {
    stages: places.length,
    value: (k, a, b) => stageVolume(basis, places[k], a, b),
    gradient: (k, a, b) => stageVolumeGradient(basis, places[k], a, b),
    roughGradient: (k, a, b) => stageVolumeGradient(basis, places[k], a, b, false),
  };
}

/**
 * Total volume when stage inlet temperatures are chosen. Each stage with a chosen temperature is taken at
 * the best temperature near the one it had at the previous point (nearbyStageTemperature; the whole range is
 * searched at the first point, the grid optimum, and whenever the local solve fails), and its Hessian comes
 * from the implicit function theorem (bestStageHessian). Stages with given temperatures are as usual.
 */
function chosenTemperatureObjective(basis: SizingBasis, places: readonly StagePlace[]): ChainObjective {
  const hints = places.map(() => NaN);
  // The refinement asks a stage's value, gradient and Hessian at one point in turn: the last answer per stage is kept.
  const last = places.map(() => ({ a: NaN, b: NaN, d: null as StageTemperatureDesign | null }));
  const chosen = places.map((p) => chosenRange(basis, p.first) !== null);
  const design = (k: number, a: number, b: number): StageTemperatureDesign => {
    const l = last[k];
    if (l.d && l.a === a && l.b === b) return l.d;
    const d = nearbyStageTemperature(basis, places[k], a, b, hints[k]) ?? bestStageTemperature(basis, places[k], a, b);
    if (Number.isFinite(d.temperature)) hints[k] = d.temperature;
    l.a = a;
    l.b = b;
    l.d = d;
    return d;
  };
  return {
    stages: places.length,
    // Converged conversions to 1e-10 leave the volume exact to round-off (it is stationary there).
    stepTolerance: 1e-10,
    value: (k, a, b) => (chosen[k] ? design(k, a, b).volume : stageVolume(basis, places[k], a, b)),
    gradient: (k, a, b) => (chosen[k] ? bestStageGradient(basis, places[k], a, b, true, design(k, a, b)) : stageVolumeGradient(basis, places[k], a, b)),
    roughGradient: (k, a, b) => (chosen[k] ? bestStageGradient(basis, places[k], a, b, false, design(k, a, b)) : stageVolumeGradient(basis, places[k], a, b, false)),
    stageHessian: (k, a, b, needA, needB) =>
      chosen[k] ? bestStageHessian(basis, places[k], a, b, needA, needB, design(k, a, b)) : differencedHessian(basis, places[k], a, b, needA, needB),
  };
}

/** A stage's Hessian by central differences of its rough gradient (the default of the refinement, per stage). */
function differencedHessian(basis: SizingBasis, place: StagePlace, a: number, b: number, needA: boolean, needB: boolean): [number, number, number] {
  const h = Math.min(1e-6, 0.25 * (b - a));
  if (!(h > 0)) return [0, 0, 0];
  const g = (p: number, q: number) => stageVolumeGradient(basis, place, p, q, false);
  let haa = 0;
  let hab = 0;
  let hbb = 0;
  if (needA) {
    const p = g(a + h, b);
    const m = g(a - h, b);
    haa = (p[0] - m[0]) / (2 * h);
    hab = (p[1] - m[1]) / (2 * h);
  }
  if (needB) {
    const p = g(a, b + h);
    const m = g(a, b - h);
    hbb = (p[1] - m[1]) / (2 * h);
    if (!needA) hab = (p[0] - m[0]) / (2 * h);
  }
  return [haa, hab, hbb];
}

function samePiece(p: Purchase, q: Purchase): boolean {
  return p.count === q.count && p.sizeIndex === q.sizeIndex;
}

/**
 * Vessel cost as a chain objective, each stage held to the piece of the cost function (parallel count and
 * standard size) it has at the grid optimum. Within a piece the cost is smooth; with standard sizes it is
 * constant, so the least total volume is sought instead.
 */
export function costObjective(
  basis: SizingBasis,
  cm: CostModel,
  places: readonly StagePlace[],
  pieces: readonly Purchase[],
): ChainObjective {
  const vessel = (k: number) => cm.vessels[vesselType(places[k].type)];
  return {
    stages: places.length,
    value: (k, a, b) => {
      const v = stageVolume(basis, places[k], a, b);
      if (!Number.isFinite(v)) return Infinity;
      const p = purchase(cm, places[k].type, v);
      if (!samePiece(p, pieces[k])) return Infinity;
      return cm.sizes ? v : p.cost;
    },
    gradient: (k, a, b) => {
      const g = stageVolumeGradient(basis, places[k], a, b);
      if (cm.sizes) return g;
      const v = stageVolume(basis, places[k], a, b);
      const { b: coef, n } = vessel(k);
      const count = pieces[k].count;
      const slope = v > 0 ? coef * n * Math.pow(v / count, n - 1) : 0;
      return [slope * g[0], slope * g[1]];
    },
  };
}
