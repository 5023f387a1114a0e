import { optimalRecycle, recycleVolumeGradient } from "./recycle";
import type { SizingBasis } from "./sizing-basis";
import { idealStageVolumeGradient, type Precision, type StagePlace } from "./stages";
import { inletBounds, stageBasisAt, temperatureSlope, type StageTemperatureDesign } from "./stage-temperature";
import { bestStageTemperature } from "./stage-temperature-search";

/** Panels of the 15-point Gauss–Kronrod rule for the gradient of a stage at its best temperature. */
const GRADIENT_PANELS = 4;

/** Partial derivatives of a stage's volume at a fixed inlet temperature T with respect to a and b. */
function gradientAtTemperature(basis: SizingBasis, place: StagePlace, a: number, b: number, temperature: number, precise: Precision): [number, number] {
  const at = stageBasisAt(basis, temperature);
  if (place.type !== "PFR-recycle") return idealStageVolumeGradient(at, { type: place.type, first: false }, a, b, precise);
  const ratio = place.recycleRatio ?? optimalRecycle(at, false, a, b).ratio;
  return recycleVolumeGradient(at, false, a, b, ratio, precise);
}

/**
 * Partial derivatives of V*(a, b) = min over T of V(a, b, T). Where the best T is inside the range or on a
 * fixed end of it they are those at that fixed T (the envelope theorem: dV/dT = 0 there, or T does not move);
 * on the cap maxTemperature - rise (b - a), which moves with a and b, the cap's motion adds
 * dV/dT * (rise, -rise), dV/dT by a one-sided second-order difference below the cap.
 */
export function bestStageGradient(
  basis: SizingBasis,
  place: StagePlace,
  a: number,
  b: number,
  precise = true,
  d: StageTemperatureDesign = bestStageTemperature(basis, place, a, b),
): [number, number] {
  if (!Number.isFinite(d.volume)) return [NaN, NaN];
  // Its integrals by a fixed rule on GRADIENT_PANELS panels (see Precision), or one panel for the Hessian.
  const g = gradientAtTemperature(basis, place, a, b, d.temperature, precise ? GRADIENT_PANELS : false);
  if (!d.capped || basis.rise === 0) return g;
  const vt = temperatureSlope(basis, place, a, b, d.temperature, precise ? GRADIENT_PANELS : 1);
  return [g[0] + vt * basis.rise, g[1] - vt * basis.rise];
}

/** Second derivatives of a stage's volume with respect to (a, b): [d2V/da2, d2V/da db, d2V/db2]. */
export type StageHessian = [number, number, number];

/**
 * Hessian of V*(a, b) = min over T of V(a, b, T) at the stage's best temperature T*, for the refinement's
 * Newton steps. Differencing the gradient of V* itself would difference T*(a, b) found anew at each
 * perturbed point; instead the parts at a fixed T are differenced (central differences of the smooth,
 * fixed-rule gradients, in a and b with step h and in T with step 1e-3 K) and joined by the implicit
 * function theorem: inside the range, H* = H - V_xT V_xT' / V_TT (the best temperature moves by -V_xT / V_TT per unit of x); on a fixed end of
 * the range, H* = H; on the cap T = maxTemperature - rise (b - a), H* = H + V_xT c' + c V_xT' + V_TT c c',
 * c = (rise, -rise). `needA`/`needB`: which of a, b are free (a fixed end is never perturbed).
 */
export function bestStageHessian(
  basis: SizingBasis,
  place: StagePlace,
  a: number,
  b: number,
  needA: boolean,
  needB: boolean,
  d: StageTemperatureDesign = bestStageTemperature(basis, place, a, b),
): StageHessian {
  const t = d.temperature;
  if (!Number.isFinite(d.volume)) return [NaN, NaN, NaN];
  const g = (p: number, q: number, temp: number) => gradientAtTemperature(basis, place, p, q, temp, false);
  const h = Math.min(1e-6, 0.25 * (b - a));
  let haa = 0;
  let hab = 0;
  let hbb = 0;
  if (needA && h > 0) {
    const p = g(a + h, b, t);
    const m = g(a - h, b, t);
    haa = (p[0] - m[0]) / (2 * h);
    hab = (p[1] - m[1]) / (2 * h);
  }
  if (needB && h > 0) {
    const p = g(a, b + h, t);
    const m = g(a, b - h, t);
    hbb = (p[1] - m[1]) / (2 * h);
    if (!needA) hab = (p[0] - m[0]) / (2 * h);
  }
  const bounds = inletBounds(basis, place.first, a, b);
  const interior = bounds !== null && t > bounds.lo && t < bounds.hi;
  if (!interior && !d.capped) return [haa, hab, hbb];
  const dt = 1e-3;
  const gp = g(a, b, t + dt);
  const gm = g(a, b, t - (d.capped ? 0 : dt));
  const span = d.capped ? dt : 2 * dt;
  const xa = (gp[0] - gm[0]) / span;
  const xb = (gp[1] - gm[1]) / span;
  const stt = (temperatureSlope(basis, place, a, b, t + dt) - temperatureSlope(basis, place, a, b, t - dt)) / (2 * dt);
  if (interior) {
    if (!(stt > 0)) return [haa, hab, hbb];
    return [haa - (xa * xa) / stt, hab - (xa * xb) / stt, hbb - (xb * xb) / stt];
  }
  const c0 = basis.rise;
  const c1 = -basis.rise;
  return [haa + 2 * xa * c0 + stt * c0 * c0, hab + xa * c1 + xb * c0 + stt * c0 * c1, hbb + 2 * xb * c1 + stt * c1 * c1];
}
