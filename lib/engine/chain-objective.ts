import { purchase, vesselType, type CostModel, type Purchase } from "./cost";
import type { SizingBasis } from "./sizing-basis";
import type { ChainObjective } from "./refine";
import { stageVolume, stageVolumeGradient } from "./stage-volume";
import type { StagePlace } from "./stages";

/** Total volume as a chain objective. */
export function volumeObjective(basis: SizingBasis, places: readonly StagePlace[]): ChainObjective {
  return {
    stages: places.length,
    value: (k, a, b) => stageVolume(basis, places[k], a, b),
    gradient: (k, a, b) => stageVolumeGradient(basis, places[k], a, b),
    roughGradient: (k, a, b) => stageVolumeGradient(basis, places[k], a, b, false),
  };
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
