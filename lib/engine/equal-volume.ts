import type { SizingBasis } from "./sizing-basis";
import { stageOutlet } from "./rating";
import { brentRoot } from "./root-finding";
import type { StagePlace } from "./stages";
import { cstrVolume } from "./stages";

function chainOutlet(basis: SizingBasis, places: readonly StagePlace[], volume: number): number[] {
  const x = [0];
  for (const p of places) x.push(stageOutlet(basis, p.type, p.first, x[x.length - 1], volume));
  return x;
}

/**
 * Boundaries of a train whose stages all have the same volume and which just reaches the target,
 * or null when no common volume does. The common volume is found by Brent's method on the outlet conversion.
 */
export function equalVolumeBoundaries(basis: SizingBasis, places: readonly StagePlace[], target: number): number[] | null {
  const single = cstrVolume(basis, true, 0, target);
  let hi = Number.isFinite(single) ? single : basis.v0;
  let reached = false;
  for (let i = 0; i < 60; i++) {
    const out = chainOutlet(basis, places, hi);
    if (out[out.length - 1] >= target) {
      reached = true;
      break;
    }
    hi *= 2;
  }
  if (!reached) return null;
  const v = brentRoot((vol) => {
    const out = chainOutlet(basis, places, vol);
    return out[out.length - 1] - target;
  }, 0, hi, 1e-13 * hi);
  const x = chainOutlet(basis, places, v);
  x[x.length - 1] = target;
  return x.map((p, i) => (i === 0 ? 0 : Math.min(p, target)));
}
