import { brentMinimum } from "./minimise-1d";
import { brentRoot } from "./root-finding";
import { chosenRange, type SizingBasis } from "./sizing-basis";
import type { StagePlace } from "./stages";
import { inletBounds, slopeBreakpoints, stageBasisAt, TEMPERATURE_SCAN, temperatureSlope, volumeAtTemperature, type StageTemperatureDesign } from "./stage-temperature";
import { basisMemo } from "./basis-memo";

const remembered = basisMemo<StageTemperatureDesign>(100_000);

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
  return remembered(basis, `${place.type}:${place.first ? 1 : 0}:${place.recycleRatio ?? ""}:${a}:${b}`, () => searchTemperature(basis, place, a, b));
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
  const breaks = slopeBreakpoints(basis, place, a, b, ts[best]);
  const slope = (t: number): number => temperatureSlope(basis, place, a, b, t, breaks);
  const done = (t: number, v: number): StageTemperatureDesign => ({ temperature: t, volume: v, capped: Number.isFinite(v) && onCap(t) });
  // An end whose slope points out of the range is a constrained minimum (the rate rising across the range).
  if (best === n - 1 && slope(hi) <= 0) return done(hi, volume(hi));
  if (best === 0 && slope(lo) >= 0) return done(lo, volume(lo));
  const left = ts[Math.max(0, best - 1)];
  const right = ts[Math.min(n - 1, best + 1)];
  const sl = slope(left);
  const sr = slope(right);
  let t: number;
  if (Number.isFinite(sl) && Number.isFinite(sr) && sl < 0 && sr > 0) t = brentRoot(slope, left, right, 1e-13 * right);
  else t = brentMinimum(volume, left, right, 1e-10).x;
  const v = volume(t);
  const sampled = volume(ts[best]);
  return v <= sampled ? done(t, v) : done(ts[best], sampled);
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
  const breaks = slopeBreakpoints(basis, place, a, b, clamp(hint));
  const slope = (t: number): number => temperatureSlope(basis, place, a, b, t, breaks);
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
