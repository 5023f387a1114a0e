import { inletTemperature, sharedPath, stageTemperature, type SizingBasis } from "./sizing-basis";
import { integrate, kronrod15 } from "./quadrature";
import type { TrainStageType } from "./types";

/** Where a stage sits: the first stage starts from the feed temperature; later ones may be reset. */
export interface StagePlace {
  readonly type: TrainStageType;
  readonly first: boolean;
  /** A tube with recycle: its recycle ratio when the user fixed it; absent or null when it is chosen. */
  readonly recycleRatio?: number | null;
}

/** Whether a stage from a to b keeps within the temperature limit and above 0 K. */
export function temperatureFeasible(basis: SizingBasis, first: boolean, a: number, b: number): boolean {
  const tIn = inletTemperature(basis, first, a);
  const tOut = tIn + basis.rise * (b - a);
  return Math.max(tIn, tOut) <= basis.maxTemperature * (1 + 1e-12) && Math.min(tIn, tOut) > 0;
}

/** FA0/(-rA) along a stage's temperature path (Infinity where the rate is not positive). */
export function levenspielHeight(basis: SizingBasis, first: boolean, a: number, x: number): number {
  const r = basis.rate(x, stageTemperature(basis, first, a, x));
  return r > 0 ? basis.fa0 / r : Infinity;
}

/** CSTR design equation V = FA0 (b - a) / (-rA at outlet conditions), m3; Infinity when infeasible. */
export function cstrVolume(basis: SizingBasis, first: boolean, a: number, b: number): number {
  if (b === a) return 0;
  if (!temperatureFeasible(basis, first, a, b)) return Infinity;
  return (b - a) * levenspielHeight(basis, first, a, b);
}

const CELL = 1 / 256;
interface FeedPathTable {
  readonly cells: number[];
  readonly height: (x: number) => number;
}
const feedPathTables = new WeakMap<SizingBasis, FeedPathTable>();

/**
 * Integral of FA0/(-rA) from 0 to x along the feed path (T0 + rise X), from cumulative cell integrals
 * memoised per basis: cell j's integral is computed once, adaptively, and reused by every later query.
 */
function feedPathIntegral(basis: SizingBasis, x: number): number {
  let table = feedPathTables.get(basis);
  if (!table) {
    table = { cells: [0], height: (v: number): number => levenspielHeight(basis, true, 0, v) };
    feedPathTables.set(basis, table);
  }
  const { cells, height } = table;
  const i = Math.floor(x / CELL);
  while (cells.length <= i) {
    const j = cells.length - 1;
    cells.push(cells[j] + integrate(height, j * CELL, (j + 1) * CELL).value);
  }
  return x === i * CELL ? cells[i] : cells[i] + integrate(height, i * CELL, x).value;
}

/**
 * FA0 * integral of dX/(-rA) from lo to hi along the temperature path of a stage that starts at a (the
 * path a tube with recycle follows from its mixed inlet lo >= a), m3; no feasibility check.
 */
export function pathVolume(basis: SizingBasis, first: boolean, a: number, lo: number, hi: number, relTol = 1e-12): number {
  if (hi === lo) return 0;
  const onFeedPath = first || sharedPath(basis);
  return onFeedPath && hi - lo > 2 * CELL
    ? feedPathIntegral(basis, hi) - feedPathIntegral(basis, lo)
    : integrate((x) => levenspielHeight(basis, first, a, x), lo, hi, relTol).value;
}

/** PFR design equation V = FA0 * integral of dX/(-rA) from a to b, m3; Infinity when infeasible. */
export function pfrVolume(basis: SizingBasis, first: boolean, a: number, b: number, relTol = 1e-12): number {
  if (b === a) return 0;
  if (!temperatureFeasible(basis, first, a, b)) return Infinity;
  // No rate at the inlet (autocatalysis from a feed without product, allowed when a tube with recycle is
  // among the candidates): a plain tube never starts.
  if (!Number.isFinite(levenspielHeight(basis, first, a, a))) return Infinity;
  const v = pathVolume(basis, first, a, a, b, relTol);
  return Number.isFinite(v) && v >= 0 ? v : Infinity;
}

/** Volume of a CSTR or a PFR, m3 (stage-volume.ts adds the tube with recycle). */
export function idealStageVolume(basis: SizingBasis, place: StagePlace, a: number, b: number): number {
  return place.type === "CSTR" ? cstrVolume(basis, place.first, a, b) : pfrVolume(basis, place.first, a, b);
}

function rateDerivatives(basis: SizingBasis, x: number, t: number): { rx: number; rt: number } {
  const h = 1e-6;
  let rx: number;
  if (x - h < 0) rx = (-3 * basis.rate(x, t) + 4 * basis.rate(x + h, t) - basis.rate(x + 2 * h, t)) / (2 * h);
  else if (x + h > basis.upper) rx = (3 * basis.rate(x, t) - 4 * basis.rate(x - h, t) + basis.rate(x - 2 * h, t)) / (2 * h);
  else rx = (basis.rate(x + h, t) - basis.rate(x - h, t)) / (2 * h);
  if (!basis.temperatureDependent || basis.rise === 0) return { rx, rt: 0 };
  const ht = 1e-5 * t;
  return { rx, rt: (basis.rate(x, t + ht) - basis.rate(x, t - ht)) / (2 * ht) };
}

/** dT/da at fixed X inside a stage: zero on a shared path, -rise when the inlet is reset. */
function inletSensitivity(basis: SizingBasis, first: boolean): number {
  return first || sharedPath(basis) ? 0 : -basis.rise;
}

/**
 * FA0 * integral from lo to b of d/da [1/(-rA)] along the path of a stage that starts at a: how moving the
 * inlet conversion a shifts the heights through the inlet temperature (zero on a shared path).
 */
export function inletShiftIntegral(basis: SizingBasis, first: boolean, a: number, lo: number, b: number, precise: Precision = true): number {
  const theta = inletSensitivity(basis, first);
  if (theta === 0 || !(b > lo)) return 0;
  const integrand = (x: number): number => {
    const t = stageTemperature(basis, first, a, x);
    const r = basis.rate(x, t);
    return -(theta * rateDerivatives(basis, x, t).rt) / (r * r);
  };
  // The Hessian differences gradients; a fixed rule keeps them smooth in (a, b) and costs less.
  if (typeof precise === "number") return basis.fa0 * compositeKronrod(integrand, lo, b, precise);
  return basis.fa0 * (precise ? integrate(integrand, lo, b, 1e-10).value : kronrod15(integrand, lo, b));
}

/**
 * How a gradient's integrals are taken: true adaptively (1e-10), false by one 15-point Gauss–Kronrod rule,
 * a number n by that rule on n equal panels (smooth in the stage's ends, and cheap: for a stage whose
 * volume is itself a minimum over its temperature, whose gradients carry that minimum's round-off anyway).
 */
export type Precision = boolean | number;

/** The 15-point Gauss–Kronrod rule on n equal panels of [lo, hi]. */
export function compositeKronrod(f: (x: number) => number, lo: number, hi: number, n: number): number {
  let sum = 0;
  for (let k = 0; k < n; k++) sum += kronrod15(f, lo + ((hi - lo) * k) / n, k === n - 1 ? hi : lo + ((hi - lo) * (k + 1)) / n);
  return sum;
}

/**
 * Partial derivatives of a stage's volume with respect to its inlet (a) and outlet (b) conversions,
 * from the differentiated design equations (Leibniz rule for the PFR integral).
 */
export function idealStageVolumeGradient(basis: SizingBasis, place: StagePlace, a: number, b: number, precise: Precision = true): [number, number] {
  const { first } = place;
  const theta = inletSensitivity(basis, first);
  const fa0 = basis.fa0;
  if (place.type === "CSTR") {
    const t = stageTemperature(basis, first, a, b);
    const r = basis.rate(b, t);
    const { rx, rt } = rateDerivatives(basis, b, t);
    const l = b - a;
    return [fa0 * (-1 / r - (l * theta * rt) / (r * r)), fa0 * (1 / r - (l * (rx + basis.rise * rt)) / (r * r))];
  }
  const db = levenspielHeight(basis, first, a, b);
  const da = -levenspielHeight(basis, first, a, a) + inletShiftIntegral(basis, first, a, a, b, precise);
  return [da, db];
}
