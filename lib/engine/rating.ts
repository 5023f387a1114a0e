import { stageTemperature, type SizingBasis } from "./sizing-basis";
import { allRoots, brentRoot } from "./root-finding";
import { recycleVolume } from "./recycle";
import { levenspielHeight, pfrVolume, temperatureFeasible } from "./stages";
import type { SteadyState, TrainStageType } from "./types";

/** Highest conversion a stage from a can approach: where the rate stops being positive or T leaves its limits. */
export function reachLimit(basis: SizingBasis, first: boolean, a: number): number {
  const top = basis.upper * (1 - 1e-12);
  const ok = (x: number): boolean =>
    temperatureFeasible(basis, first, a, x) && basis.rate(x, stageTemperature(basis, first, a, x)) > 0;
  if (ok(top)) {
    // A positive rate at the top does not rule out a dip in between; scan coarsely.
    let fine = true;
    for (let i = 1; i < 256 && fine; i++) fine = ok(a + ((top - a) * i) / 256);
    if (fine) return top;
  }
  let lo = a;
  let hi = top;
  for (let i = 1; i <= 256; i++) {
    const x = a + ((top - a) * i) / 256;
    if (!ok(x)) {
      hi = x;
      break;
    }
    lo = x;
  }
  for (let i = 0; i < 80 && hi - lo > 1e-15; i++) {
    const mid = 0.5 * (lo + hi);
    if (ok(mid)) lo = mid;
    else hi = mid;
  }
  return lo;
}

/**
 * PFR rating: outlet conversion of a PFR of volume V (m3) fed at conversion a. Solves
 * V(a, x) = V by Newton's method, whose derivative dV/dx = FA0/(-rA) is the Levenspiel height
 * itself, kept inside a shrinking bracket (bisection when a step would leave it); Brent's
 * method finishes any case Newton does not settle in 30 steps.
 */
export function pfrOutlet(basis: SizingBasis, first: boolean, a: number, volume: number): number {
  if (volume <= 0) return a;
  const hi = reachLimit(basis, first, a);
  const full = pfrVolume(basis, first, a, hi);
  if (full <= volume) return hi;
  let lo = a;
  let up = hi;
  let x = Number.isFinite(full) ? a + ((hi - a) * volume) / full : 0.5 * (a + hi);
  for (let i = 0; i < 30; i++) {
    const g = pfrVolume(basis, first, a, x) - volume;
    if (g === 0) return x;
    if (g > 0) up = x;
    else lo = x;
    const step = g / levenspielHeight(basis, first, a, x);
    let next = x - step;
    if (!(next > lo && next < up)) next = 0.5 * (lo + up);
    if (Math.abs(next - x) <= 1e-15 * Math.max(1, Math.abs(x)) || up - lo <= 1e-15) return next;
    x = next;
  }
  return brentRoot((y) => pfrVolume(basis, first, a, y) - volume, lo, up, 1e-15);
}

/**
 * CSTR rating: every steady state of FA0 (X - a) = V (-rA(X, T(X))), found by a scan of 2000 brackets and
 * Brent's method in each sign change (an adiabatic CSTR may have several).
 */
export function cstrSteadyStates(basis: SizingBasis, first: boolean, a: number, volume: number): SteadyState[] {
  if (volume <= 0) return [{ conversionOut: a, temperatureOut: stageTemperature(basis, first, a, a) }];
  const hi = reachLimit(basis, first, a);
  const f = (x: number): number => (x - a) * basis.fa0 - volume * basis.rate(x, stageTemperature(basis, first, a, x));
  const roots = allRoots(f, a, hi, basis.rise === 0 ? 200 : 2000).filter((x) => x > a);
  const xs = roots.length > 0 ? roots : [hi];
  return xs.map((x) => ({ conversionOut: x, temperatureOut: stageTemperature(basis, first, a, x) }));
}

/**
 * Tube with recycle rating: every outlet b with V(a, b; R) = V, V = (R + 1) FA0 integral from X_1 to b of
 * dX/(-rA). With recycle the volume needed need not rise with b (dV/db = (R + 1) h(b) - R h(X_1) can be
 * negative when the rate rises with conversion), so like a stirred tank it may have several steady states:
 * found by the same scan of brackets (200 isothermal, 2000 adiabatic) and Brent's method. With none, the
 * stage reaches its limit.
 */
export function recycleSteadyStates(basis: SizingBasis, first: boolean, a: number, volume: number, ratio: number): SteadyState[] {
  if (volume <= 0) return [{ conversionOut: a, temperatureOut: stageTemperature(basis, first, a, a) }];
  const hi = reachLimit(basis, first, a);
  const f = (x: number): number => {
    const v = recycleVolume(basis, first, a, x, ratio);
    return (Number.isFinite(v) ? v : Number.MAX_VALUE) - volume;
  };
  const roots = allRoots(f, a, hi, basis.rise === 0 ? 200 : 2000).filter((x) => x > a);
  const xs = roots.length > 0 ? roots : [hi];
  return xs.map((x) => ({ conversionOut: x, temperatureOut: stageTemperature(basis, first, a, x) }));
}

/**
 * Outlet of a stage by volume; for several steady states the lowest (reached from a cold start).
 * `recycleRatio` is a tube with recycle's R.
 */
export function stageOutlet(basis: SizingBasis, type: TrainStageType, first: boolean, a: number, volume: number, recycleRatio = 0): number {
  if (type === "PFR-recycle") return recycleSteadyStates(basis, first, a, volume, recycleRatio)[0].conversionOut;
  return type === "PFR" ? pfrOutlet(basis, first, a, volume) : cstrSteadyStates(basis, first, a, volume)[0].conversionOut;
}

/** The height of the Levenspiel curve, re-exported for rating reports. */
export { levenspielHeight };
