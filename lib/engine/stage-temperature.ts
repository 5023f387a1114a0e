import { brentMinimum } from "./minimise-1d";
import { optimalRecycle, recycleInletConversion, recycleVolume, recycleVolumeGradient } from "./recycle";
import { brentRoot } from "./root-finding";
import { chosenRange, type SizingBasis } from "./sizing-basis";
import { compositeKronrod, idealStageVolume, idealStageVolumeGradient, pfrVolume, type Precision, type StagePlace } from "./stages";

/*
 * Stage inlet temperatures as decision variables. A stage's volume depends only on its inlet conversion a,
 * its outlet conversion b and its own inlet temperature T (its path is T + rise (X - a)); nothing else in
 * the train sees T. So the least volume of a stage over T, V*(a, b) = min over T of V(a, b, T), is again a
 * function of (a, b) alone, and the train's optimum over conversions and temperatures is the optimum over
 * conversions of the sum of V*: the conversion grid's dynamic programme and the refinement take V* in
 * place of V, unchanged in structure.
 */

/** Points of the scan over the temperature range before Brent's method (see minimiseOnRange). */
export const TEMPERATURE_SCAN = 13;

/** A stage at its best inlet temperature. */
export interface StageTemperatureDesign {
  /** Inlet temperature, K (NaN when no temperature of the range works). */
  readonly temperature: number;
  /** Volume there, m3 (Infinity when infeasible). */
  readonly volume: number;
  /** Whether the temperature sits on the cap maxTemperature - rise (b - a), which moves with a and b. */
  readonly capped: boolean;
}

/**
 * The basis of one stage whose inlet temperature is T: computed as a later stage (first = false) reset to T,
 * its path its own.
 */
export function stageBasisAt(basis: SizingBasis, temperature: number): SizingBasis {
  // A stage's volume, slope and gradient are asked at one temperature in turn: the last basis is kept.
  const last = lastAt.get(basis);
  if (last && last.t0 === temperature) return last;
  const at = { ...basis, t0: temperature, interstage: temperature, choice: undefined, ownPath: true };
  lastAt.set(basis, at);
  return at;
}

const lastAt = new WeakMap<SizingBasis, SizingBasis>();

/**
 * Inlet temperatures a stage from a to b may have: the range given, below the cap that keeps the stage
 * within the maximum temperature (an exothermic stage heats by rise (b - a)); null when none.
 */
export function inletBounds(basis: SizingBasis, first: boolean, a: number, b: number): { lo: number; hi: number; cap: number } | null {
  const range = chosenRange(basis, first);
  if (!range) return null;
  const heat = basis.rise * (b - a);
  const cap = basis.maxTemperature - Math.max(0, heat);
  const lo = Math.max(range[0], heat < 0 ? -heat * (1 + 1e-12) : 0);
  const hi = Math.min(range[1], cap);
  return hi >= lo ? { lo, hi, cap } : null;
}

/** Volume of a stage from a to b entering at temperature T, m3 (the recycle ratio chosen or fixed as asked). */
export function volumeAtTemperature(basis: SizingBasis, place: StagePlace, a: number, b: number, temperature: number, relTol = 1e-12): number {
  const at = stageBasisAt(basis, temperature);
  if (place.type === "PFR") return pfrVolume(at, false, a, b, relTol);
  if (place.type !== "PFR-recycle") return idealStageVolume(at, { type: place.type, first: false }, a, b);
  if (place.recycleRatio !== undefined && place.recycleRatio !== null) return recycleVolume(at, false, a, b, place.recycleRatio);
  return optimalRecycle(at, false, a, b).volume;
}

/**
 * dV/dT of a stage from a to b entering at temperature T, m3/K: FA0 times the integral of d(1/(-rA))/dT
 * along the stage's path (every point of the path moves with its inlet temperature), over the tube (from the
 * mixed inlet X_1 for a tube with recycle, times R + 1 at its best R: the envelope theorem), or at the outlet
 * for a stirred tank. dr/dT by central differences (relative step 1e-5).
 */
export function temperatureSlope(basis: SizingBasis, place: StagePlace, a: number, b: number, temperature: number, panels = 1): number {
  if (b <= a) return 0;
  const at = stageBasisAt(basis, temperature);
  const slope = (x: number): number => {
    const t = temperature + basis.rise * (x - a);
    const r = at.rate(x, t);
    const ht = 1e-5 * t;
    return -(at.rate(x, t + ht) - at.rate(x, t - ht)) / (2 * ht) / (r * r);
  };
  if (place.type === "CSTR") return basis.fa0 * (b - a) * slope(b);
  let lo = a;
  let scale = 1;
  if (place.type === "PFR-recycle") {
    const ratio = place.recycleRatio ?? optimalRecycle(at, false, a, b).ratio;
    lo = recycleInletConversion(a, b, ratio);
    scale = ratio + 1;
  }
  // A fixed composite rule, not an adaptive one: the integrand carries the differencing's noise (about
  // 1e-10 relative), which would drive an adaptive rule to its panel limit; and a fixed rule is smooth in
  // (a, b, T), which keeps the best temperature a smooth function of the conversions for the Newton steps.
  return scale * basis.fa0 * compositeKronrod(slope, lo, b, panels);
}

/** Panels of the 15-point Gauss–Kronrod rule for the gradient of a stage at its best temperature. */
const GRADIENT_PANELS = 4;

/**
 * Panels of the 15-point Gauss–Kronrod rule for dV/dT where the best temperature is reported: the search
 * solves with one panel (cheap, and smooth in T, so Brent's method converges fast) and then takes two
 * secant steps with this many, which removes the one panel's bias (seen up to 1e-9 of the volume).
 */
const POLISH_PANELS = 16;

const memo = new WeakMap<SizingBasis, Map<string, StageTemperatureDesign>>();

/**
 * The inlet temperature of least volume for a stage from a to b, within its range and cap. A scan of
 * TEMPERATURE_SCAN temperatures evenly over the range picks the basin (so a volume with several minima in T
 * is searched globally at that resolution; a minimum narrower than the spacing can be missed); in it the
 * stationary point dV/dT = 0 is solved by Brent's root finder on the slope (accurate to round-off, where a
 * search on the volume itself, flat at its minimum, stops at the square root of the machine precision),
 * falling back to Brent's minimiser when the slope has no clean sign change (a volume that becomes
 * infinite inside the bracket, past the equilibrium). An end of the range is the answer when the slope
 * points out of the range there. Memoised per request: the refinement asks for a stage's value, gradient
 * and Hessian at the same conversions in turn.
 */
export function bestStageTemperature(basis: SizingBasis, place: StagePlace, a: number, b: number): StageTemperatureDesign {
  let cache = memo.get(basis);
  if (!cache) {
    cache = new Map();
    memo.set(basis, cache);
  }
  const key = `${place.type}:${place.first ? 1 : 0}:${place.recycleRatio ?? ""}:${a}:${b}`;
  const hit = cache.get(key);
  if (hit) return hit;
  const design = searchTemperature(basis, place, a, b);
  if (cache.size > 100_000) cache.clear();
  cache.set(key, design);
  return design;
}

function searchTemperature(basis: SizingBasis, place: StagePlace, a: number, b: number): StageTemperatureDesign {
  const bounds = inletBounds(basis, place.first, a, b);
  if (!bounds) return { temperature: NaN, volume: Infinity, capped: false };
  const { lo, hi, cap } = bounds;
  const onCap = (t: number): boolean => t === hi && hi === cap && hi > lo;
  const volume = (t: number): number => volumeAtTemperature(basis, place, a, b, t);
  // The scan only chooses the basin: its tubes are integrated to 1e-7.
  const rough = (t: number): number => volumeAtTemperature(basis, place, a, b, t, 1e-7);
  if (!(hi > lo) || b <= a) {
    const v = volume(lo);
    return { temperature: lo, volume: v, capped: false };
  }
  const n = TEMPERATURE_SCAN;
  const ts: number[] = [];
  const vs: number[] = [];
  let best = 0;
  for (let i = 0; i < n; i++) {
    ts.push(i === n - 1 ? hi : lo + ((hi - lo) * i) / (n - 1));
    vs.push(rough(ts[i]));
    if (vs[i] < vs[best] || !Number.isFinite(vs[best])) best = i;
  }
  if (!Number.isFinite(vs[best])) return { temperature: NaN, volume: Infinity, capped: false };
  const slope = (t: number): number => temperatureSlope(basis, place, a, b, t);
  const done = (t: number, v: number): StageTemperatureDesign => ({ temperature: t, volume: v, capped: Number.isFinite(v) && onCap(t) });
  // An end whose slope points out of the range is a constrained minimum (the rate rising across the range).
  if (best === n - 1 && slope(hi) <= 0) return done(hi, volume(hi));
  if (best === 0 && slope(lo) >= 0) return done(lo, volume(lo));
  const left = ts[Math.max(0, best - 1)];
  const right = ts[Math.min(n - 1, best + 1)];
  const sl = slope(left);
  const sr = slope(right);
  let t: number;
  if (Number.isFinite(sl) && Number.isFinite(sr) && sl < 0 && sr > 0) t = polish(basis, place, a, b, brentRoot(slope, left, right, 1e-13 * right), left, right);
  else t = brentMinimum(volume, left, right, 1e-10).x;
  const v = volume(t);
  const sampled = volume(ts[best]);
  return v <= sampled ? done(t, v) : done(ts[best], sampled);
}

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

/**
 * What a stage from a to b is computed on: for a stage whose inlet temperature is chosen, the basis at its
 * best temperature (as a reset stage, first = false); otherwise the train's own basis and place.
 */
export function stageFrame(basis: SizingBasis, place: StagePlace, a: number, b: number): { basis: SizingBasis; first: boolean; chosen: boolean } {
  if (!chosenRange(basis, place.first)) return { basis, first: place.first, chosen: false };
  const d = bestStageTemperature(basis, place, a, b);
  const t = Number.isFinite(d.temperature) ? d.temperature : (inletBounds(basis, place.first, a, b)?.lo ?? chosenRange(basis, place.first)?.[0] ?? basis.t0);
  return { basis: stageBasisAt(basis, t), first: false, chosen: true };
}

/** Two secant steps on dV/dT = 0 with the many-panel rule from t, kept within [lo, hi]. */
function polish(basis: SizingBasis, place: StagePlace, a: number, b: number, t: number, lo: number, hi: number): number {
  const f = (u: number): number => temperatureSlope(basis, place, a, b, u, POLISH_PANELS);
  let t0 = t;
  let f0 = f(t0);
  let t1 = Math.min(hi, Math.max(lo, t0 + (t0 < hi ? 1e-3 : -1e-3)));
  let f1 = f(t1);
  for (let i = 0; i < 2; i++) {
    if (!(Number.isFinite(f0) && Number.isFinite(f1)) || f1 === f0) break;
    const t2 = Math.min(hi, Math.max(lo, t1 - (f1 * (t1 - t0)) / (f1 - f0)));
    t0 = t1;
    f0 = f1;
    t1 = t2;
    if (Math.abs(t1 - t0) <= 1e-13 * t1) break;
    f1 = f(t1);
  }
  return t1;
}

/**
 * The best inlet temperature near a known one (the same stage's at nearby conversions, in the refinement):
 * the root of dV/dT by the secant method from `hint`, or an end of the range where the slope points out of
 * it. Null when that fails (no convexity, no finite volume, no convergence in 30 steps): the caller then
 * searches the whole range. Local by design: the refinement is a local method in the conversions and the
 * temperatures together, started from the global search's temperature at the grid optimum.
 */
export function nearbyStageTemperature(basis: SizingBasis, place: StagePlace, a: number, b: number, hint: number): StageTemperatureDesign | null {
  const bounds = inletBounds(basis, place.first, a, b);
  if (!bounds || !(bounds.hi > bounds.lo) || b <= a || !Number.isFinite(hint)) return null;
  const { lo, hi, cap } = bounds;
  const clamp = (t: number): number => Math.min(hi, Math.max(lo, t));
  const slope = (t: number): number => temperatureSlope(basis, place, a, b, t);
  const finish = (t: number): StageTemperatureDesign | null => {
    const v = volumeAtTemperature(basis, place, a, b, t);
    return Number.isFinite(v) ? { temperature: t, volume: v, capped: t === hi && hi === cap } : null;
  };
  let t0 = clamp(hint);
  let s0 = slope(t0);
  if (!Number.isFinite(s0)) return null;
  if (t0 === hi && s0 <= 0) return finish(hi);
  if (t0 === lo && s0 >= 0) return finish(lo);
  let t1 = clamp(t0 - Math.sign(s0) * 1e-2);
  let s1 = slope(t1);
  for (let i = 0; i < 30; i++) {
    if (!Number.isFinite(s1) || !(Math.sign(t1 - t0) * (s1 - s0) > 0)) return null;
    const t2 = clamp(t1 - (s1 * (t1 - t0)) / (s1 - s0));
    if (Math.abs(t2 - t1) <= 1e-12 * t2) return finish(t2);
    const s2 = slope(t2);
    if ((t2 === hi && s2 <= 0) || (t2 === lo && s2 >= 0)) return finish(t2);
    t0 = t1;
    s0 = s1;
    t1 = t2;
    s1 = s2;
  }
  return null;
}
