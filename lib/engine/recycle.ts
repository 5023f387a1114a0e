import { kronrod15 } from "./quadrature";
import { brentRoot } from "./root-finding";
import type { SizingBasis } from "./sizing-basis";
import { inletShiftIntegral, levenspielHeight, pathVolume, temperatureFeasible, type Precision } from "./stages";
import { basisMemo } from "./basis-memo";
import { goldenSection } from "./minimise-1d";

/*
 * A tube with part of its outlet recycled to its inlet (Levenspiel, Chemical Reaction Engineering, 3rd
 * ed., ch. 6). Conversions are on the train's basis FA0. The stage is fed at X_in = a and leaves at
 * X_out = b; R is the recycled flow over the flow leaving the stage. Mixing the fresh stream (a) with R
 * parts of outlet (b) gives the tube, which carries (R + 1) FA0, the inlet conversion
 *   X_1 = (a + R b)/(R + 1) = a + R (b - a)/(R + 1),
 * because the unconverted A of the mix, FA0 (1 - a) + R FA0 (1 - b), is (R + 1) FA0 (1 - X_1). Every
 * concentration is the same function of X on that basis (liquid, and isobaric ideal gas, whose molar and
 * volumetric flows both mix linearly), and an adiabatic mix of the two streams lies on the stage's own
 * line T = T_in + rise (X - a), since both do; so the tube sees the same FA0/(-rA) curve as a plain tube
 * from a, and
 *   V = (R + 1) FA0 integral from X_1 to b of dX/(-rA).
 * Since (R + 1)(b - X_1) = b - a, V is (b - a) times the mean of FA0/(-rA) over [X_1, b]: the Levenspiel
 * rectangle over [a, b] at the tube's mean height. R = 0 is the plain tube; R -> infinity is the stirred
 * tank (X_1 -> b).
 */

/**
 * Largest recycle ratio the design chooses. Past it the stage is a stirred tank in all but name (its volume
 * is within about 1/R of the tank's, which the search offers as its own type).
 */
export const RECYCLE_RATIO_MAX = 1000;

/** Conversion at the tube's inlet once R parts of the outlet are mixed with the stage's feed. */
export function recycleInletConversion(a: number, b: number, ratio: number): number {
  return a + (ratio / (ratio + 1)) * (b - a);
}

/** Volume of a tube with recycle ratio R from a to b, m3; Infinity when infeasible. */
export function recycleVolume(basis: SizingBasis, first: boolean, a: number, b: number, ratio: number): number {
  if (b === a) return 0;
  if (!temperatureFeasible(basis, first, a, b)) return Infinity;
  const x1 = recycleInletConversion(a, b, ratio);
  const v = (ratio + 1) * pathVolume(basis, first, a, x1, b);
  return Number.isFinite(v) && v >= 0 ? v : Infinity;
}

/**
 * Partial derivatives of the volume at a fixed R with respect to the stage's inlet (a) and outlet (b):
 * dV/da = -h(X_1) (+ the inlet temperature's shift of the heights when the inlet is reset) and
 * dV/db = (R + 1) h(b) - R h(X_1), with h = FA0/(-rA). At the optimal R they are also the derivatives of
 * the optimised volume (the envelope theorem: dV/dR = 0 there, or R sits on a bound that moves with a, b
 * only through X_1, which these already follow).
 */
export function recycleVolumeGradient(basis: SizingBasis, first: boolean, a: number, b: number, ratio: number, precise: Precision = true): [number, number] {
  const x1 = recycleInletConversion(a, b, ratio);
  const h1 = levenspielHeight(basis, first, a, x1);
  const hb = levenspielHeight(basis, first, a, b);
  const shift = inletShiftIntegral(basis, first, a, x1, b, precise);
  return [-h1 + (ratio + 1) * shift, (ratio + 1) * hb - ratio * h1];
}

/** A tube with recycle at its best recycle ratio. */
export interface RecycleDesign {
  readonly ratio: number;
  readonly volume: number;
}

/** Samples of the tube's inlet conversion before the local search; see optimalRecycle. */
const SCAN = 16;
const remembered = basisMemo<RecycleDesign>(50_000);

/**
 * The recycle ratio that minimises the volume of a tube with recycle from a to b, within
 * [0, RECYCLE_RATIO_MAX], and that volume.
 *
 * With u = X_1 the tube's inlet conversion, V(u) = (b - a) m(u), m(u) the mean of h = FA0/(-rA) over
 * [u, b], and m'(u) = (m(u) - h(u))/(b - u): the optimum satisfies h(u) = m(u), the height at the tube's
 * inlet equals its mean over the tube (Levenspiel, ch. 6). When h sampled at those 17 points and b never
 * falls, the answer is R = 0; when it never rises, the largest R (see the comment in searchRecycle). Else m
 * is sampled at 17 inlet conversions from a to the bound (a backward running sum of 16 fixed-rule integrals); around the best sample the sign change of
 * g(u) = h(u)(b - u) - FA0 integral(u..b) is solved by Brent's method (golden-section search on m when the
 * bracket holds no clean sign change). A minimum of m between samples narrower than a sample spacing can
 * be missed; the sampling only chooses the basin.
 */
export function optimalRecycle(basis: SizingBasis, first: boolean, a: number, b: number): RecycleDesign {
  if (b <= a) return { ratio: 0, volume: 0 };
  return remembered(basis, `${first ? 1 : 0}:${a}:${b}`, () => searchRecycle(basis, first, a, b));
}

function searchRecycle(basis: SizingBasis, first: boolean, a: number, b: number): RecycleDesign {
  const infeasible = { ratio: 0, volume: Infinity };
  if (!temperatureFeasible(basis, first, a, b)) return infeasible;
  if (!Number.isFinite(levenspielHeight(basis, first, a, b))) return infeasible;
  const length = b - a;
  const uMax = recycleInletConversion(a, b, RECYCLE_RATIO_MAX);
  const h = (u: number): number => levenspielHeight(basis, first, a, u);
  const tail = (u: number): number => pathVolume(basis, first, a, u, b);
  const us: number[] = [];
  for (let k = 0; k <= SCAN; k++) us.push(k === SCAN ? uMax : a + ((uMax - a) * k) / SCAN);
  // Heights first (no integrals): where they never fall from a to b the mean over [u, b] is least at u = a
  // (no recycle: the plain tube); where they never rise it is least at the largest R. Most rate laws are
  // one or the other over a stage, and both cost one integral. Only a curve with a minimum needs the scan.
  const heights = us.map(h);
  heights.push(h(b));
  let rising = true;
  let falling = true;
  for (let k = 1; k < heights.length; k++) {
    if (heights[k] < heights[k - 1]) rising = false;
    if (heights[k] > heights[k - 1]) falling = false;
  }
  if (rising) return { ratio: 0, volume: recycleVolume(basis, first, a, b, 0) };
  if (falling) return { ratio: RECYCLE_RATIO_MAX, volume: recycleVolume(basis, first, a, b, RECYCLE_RATIO_MAX) };
  // The scan only chooses the basin, so each interval gets one fixed 15-point rule (the path integral from
  // the top is exact); the solve below integrates adaptively, over short intervals only.
  const means = new Array<number>(SCAN + 1).fill(Infinity);
  let sum = tail(uMax);
  means[SCAN] = sum / (b - uMax);
  // A zero rate at the stage's inlet (autocatalysis from a pure feed) makes R = 0 impossible: the first
  // interval's integral diverges, so it is not summed.
  const startFinite = Number.isFinite(heights[0]);
  for (let k = SCAN - 1; k >= 0; k--) {
    if (k === 0 && !startFinite) break;
    sum += kronrod15(h, us[k], us[k + 1]);
    means[k] = sum / (b - us[k]);
  }
  let best = 0;
  for (let k = 1; k <= SCAN; k++) if (means[k] < means[best]) best = k;
  if (!Number.isFinite(means[best])) return infeasible;
  // Within the bracket [lo, hi] the tail is the exact integral from hi plus a short one from u to hi.
  const lo = best > 0 ? us[best - 1] : us[0];
  const hi = best < SCAN ? us[best + 1] : us[SCAN];
  const fromHi = tail(hi);
  const tailIn = (u: number): number => pathVolume(basis, first, a, u, hi) + fromHi;
  const g = (u: number): number => h(u) * (b - u) - tailIn(u);
  const gBest = g(us[best]);
  let u = us[best];
  if (gBest > 0 && best < SCAN) u = localMinimum(g, (v) => tailIn(v) / (b - v), us[best], hi, gBest);
  else if (gBest < 0 && best > 0) u = localMinimum(g, (v) => tailIn(v) / (b - v), lo, us[best], undefined, gBest);
  // R from u; u at a (R = 0) or at the bound are the ends of the range.
  const ratio = u <= a ? 0 : Math.min(RECYCLE_RATIO_MAX, (u - a) / (b - u));
  const volume = recycleVolume(basis, first, a, b, ratio);
  // The sampled optimum is never given up for a worse refined one (a safeguard only).
  const sampledRatio = best === 0 ? 0 : Math.min(RECYCLE_RATIO_MAX, (us[best] - a) / (b - us[best]));
  const sampled = length * (tailIn(us[best]) / (b - us[best]));
  if (!(volume <= sampled * (1 + 1e-12))) return { ratio: sampledRatio, volume: recycleVolume(basis, first, a, b, sampledRatio) };
  return { ratio, volume };
}

/**
 * Where m has its minimum in [lo, hi]: the root of g (m' = -g/(b - u)^2, so g goes from + to -) when g
 * changes sign over the bracket, else golden-section search on m.
 */
function localMinimum(g: (u: number) => number, m: (u: number) => number, lo: number, hi: number, gLo?: number, gHi?: number): number {
  const fl = gLo ?? g(lo);
  const fh = gHi ?? g(hi);
  if (fl > 0 && fh < 0) return brentRoot(g, lo, hi, 1e-15 * Math.max(1, Math.abs(hi)));
  return goldenSection(m, lo, hi, { maxIter: 80, width: () => 1e-14 });
}
