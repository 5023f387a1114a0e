import { inletTemperature, sharedPath, stageTemperature, type SizingBasis } from "./sizing-basis";
import { integrate, kronrod15 } from "./quadrature";
import type { StageType } from "./types";

/** Where a stage sits: the first stage starts from the feed temperature; later ones may be reset. */
export interface StagePlace {
  readonly type: StageType;
  readonly first: boolean;
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

/** PFR design equation V = FA0 * integral of dX/(-rA) from a to b, m3; Infinity when infeasible. */
export function pfrVolume(basis: SizingBasis, first: boolean, a: number, b: number, relTol = 1e-12): number {
  if (b === a) return 0;
  if (!temperatureFeasible(basis, first, a, b)) return Infinity;
  const onFeedPath = first || sharedPath(basis);
  const v =
    onFeedPath && b - a > 2 * CELL
      ? feedPathIntegral(basis, b) - feedPathIntegral(basis, a)
      : integrate((x) => levenspielHeight(basis, first, a, x), a, b, relTol).value;
  return Number.isFinite(v) && v >= 0 ? v : Infinity;
}

/** Volume of a stage of either type, m3. */
export function stageVolume(basis: SizingBasis, place: StagePlace, a: number, b: number): number {
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
 * Partial derivatives of a stage's volume with respect to its inlet (a) and outlet (b) conversions,
 * from the differentiated design equations (Leibniz rule for the PFR integral).
 */
export function stageVolumeGradient(basis: SizingBasis, place: StagePlace, a: number, b: number, precise = true): [number, number] {
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
  let da = -levenspielHeight(basis, first, a, a);
  if (theta !== 0 && b > a) {
    const integrand = (x: number): number => {
      const t = stageTemperature(basis, first, a, x);
      const r = basis.rate(x, t);
      return (theta * rateDerivatives(basis, x, t).rt) / (r * r);
    };
    // The Hessian differences gradients; a fixed rule keeps them smooth in (a, b) and costs less.
    da -= fa0 * (precise ? integrate(integrand, a, b, 1e-10).value : kronrod15(integrand, a, b));
  }
  return [da, db];
}
