import { stageObjective, type CostModel } from "./cost";
import { sharedPath, type SizingBasis } from "./sizing-basis";
import { recycleInletConversion } from "./recycle";
import { levenspielHeight, temperatureFeasible } from "./stages";
import type { TrainStageType } from "./types";
import { buildChosenTemperatureTables } from "./grid-tables-chosen";

/**
 * Objective of every stage between two points of a conversion grid, computed once and shared by all
 * sequences: first[type][j] for a first stage 0 -> x_j, later[type][i*m + j] for a later stage x_i -> x_j.
 */
export interface GridTables {
  readonly m: number;
  readonly x: Float64Array;
  readonly first: Readonly<Record<TrainStageType, Float64Array>>;
  readonly later: Readonly<Record<TrainStageType, Float64Array>>;
}

/** Whether the sequences hold tubes with recycle, and their fixed recycle ratio (null: chosen per stage). */
export interface RecycleGrid {
  readonly used: boolean;
  readonly ratio: number | null;
}

export function uniformGrid(target: number, m: number): Float64Array {
  const x = new Float64Array(m);
  for (let j = 0; j < m; j++) x[j] = (target * j) / (m - 1);
  x[m - 1] = target;
  return x;
}

/** Heights FA0/(-rA) and cumulative PFR volumes along the path of a stage that starts at x[i]. */
export function pathFrom(basis: SizingBasis, first: boolean, x: Float64Array, i: number) {
  const m = x.length;
  const a = x[i];
  const height = new Float64Array(m).fill(Infinity);
  const cumulative = new Float64Array(m).fill(Infinity);
  // segment[j]: the integral over cell j-1 .. j alone, finite even where the cumulative one is not (a
  // zero rate at the stage's inlet), which a tube with recycle never integrates from.
  const segment = new Float64Array(m).fill(Infinity);
  height[i] = levenspielHeight(basis, first, a, a);
  cumulative[i] = 0;
  for (let j = i + 1; j < m; j++) {
    if (!temperatureFeasible(basis, first, a, x[j])) break;
    height[j] = levenspielHeight(basis, first, a, x[j]);
    if (!Number.isFinite(height[j])) break;
    // Simpson's rule per cell, reusing the heights at the grid points: the tables only have to pick the
    // basin of the optimum and a start for the refinement, which works at full precision.
    const mid = levenspielHeight(basis, first, a, 0.5 * (x[j - 1] + x[j]));
    segment[j] = ((x[j] - x[j - 1]) / 6) * (height[j - 1] + 4 * mid + height[j]);
    cumulative[j] = cumulative[j - 1] + segment[j];
  }
  return { height, cumulative, segment };
}

export function fillRow(
  out: Record<"CSTR" | "PFR", Float64Array>,
  offset: number,
  x: Float64Array,
  i: number,
  path: ReturnType<typeof pathFrom>,
  baseVolume: number,
  cm: CostModel,
): void {
  const m = x.length;
  for (let j = 0; j < m; j++) {
    const k = offset + j;
    if (j < i) {
      out.CSTR[k] = Infinity;
      out.PFR[k] = Infinity;
      continue;
    }
    const cstr = j === i ? 0 : (x[j] - x[i]) * path.height[j];
    const pfr = j === i ? 0 : path.cumulative[j] - baseVolume;
    out.CSTR[k] = stageObjective(cm, "CSTR", cstr);
    out.PFR[k] = stageObjective(cm, "PFR", pfr);
  }
}

export type Path = ReturnType<typeof pathFrom>;

/**
 * Tubes with a chosen recycle ratio from x_i to every x_j: (x_j - x_i) times the least mean height over
 * [x_k, x_j] for grid points x_k in [x_i, x_j) (the tube's inlet on the grid), or the height at x_j (the
 * stirred-tank limit of a large ratio). With row "all" the path does not depend on x_i (a shared path),
 * so one backward pass per j fills every row (O(m^2)); else only the given row, from its own path.
 */
export function fillRecycleChosen(out: Float64Array, offset: number, x: Float64Array, path: Path, row: number | "all", cm: CostModel): void {
  const m = x.length;
  const lowest = row === "all" ? 0 : row;
  const at = (i: number, j: number): number => (row === "all" ? i * m + j : offset + j);
  for (let i = lowest; i < (row === "all" ? m : lowest + 1); i++) for (let j = 0; j <= i; j++) out[at(i, j)] = j === i ? 0 : Infinity;
  for (let j = lowest + 1; j < m; j++) {
    let best = path.height[j];
    let sum = 0;
    for (let k = j - 1; k >= lowest; k--) {
      sum += path.segment[k + 1];
      const mean = sum / (x[j] - x[k]);
      if (mean < best) best = mean;
      if (row === "all") out[at(k, j)] = stageObjective(cm, "PFR-recycle", Number.isFinite(path.height[j]) ? (x[j] - x[k]) * best : Infinity);
    }
    if (row !== "all") out[at(lowest, j)] = stageObjective(cm, "PFR-recycle", Number.isFinite(path.height[j]) ? (x[j] - x[lowest]) * best : Infinity);
  }
}

/** Tubes with a fixed recycle ratio from x_i (row i of `out`) to every x_j, on the path that starts at x_i. */
export function fillRecycleFixed(
  basis: SizingBasis,
  first: boolean,
  out: Float64Array,
  offset: number,
  x: Float64Array,
  i: number,
  path: Path,
  ratio: number,
  cm: CostModel,
): void {
  const m = x.length;
  const dx = x[m - 1] / (m - 1);
  // Prefix sums of the cells after the first, which may not be finite (a zero rate at x_i).
  const prefix = new Float64Array(m);
  for (let j = i + 2; j < m; j++) prefix[j] = prefix[j - 1] + path.segment[j];
  for (let j = 0; j < m; j++) {
    if (j <= i) {
      out[offset + j] = j === i ? 0 : Infinity;
      continue;
    }
    if (!Number.isFinite(path.height[j])) {
      out[offset + j] = Infinity;
      continue;
    }
    const x1 = recycleInletConversion(x[i], x[j], ratio);
    const p = Math.min(j - 1, Math.max(i, Math.floor(x1 / dx)));
    // Simpson's rule over [x1, x_(p+1)], then whole cells to x_j.
    const h1 = levenspielHeight(basis, first, x[i], x1);
    const hm = levenspielHeight(basis, first, x[i], 0.5 * (x1 + x[p + 1]));
    const partial = ((x[p + 1] - x1) / 6) * (h1 + 4 * hm + path.height[p + 1]);
    const whole = p + 1 >= i + 2 ? prefix[j] - prefix[p + 1] : prefix[j];
    const integral = x1 === x[p + 1] ? whole : partial + whole;
    out[offset + j] = stageObjective(cm, "PFR-recycle", (ratio + 1) * integral);
  }
}

function fillRecycle(basis: SizingBasis, recycle: RecycleGrid, x: Float64Array, feedPath: Path, cm: CostModel): { first: Float64Array; later: Float64Array } {
  const m = x.length;
  const first = new Float64Array(m);
  const later = new Float64Array(m * m);
  const shared = sharedPath(basis);
  if (recycle.ratio === null) {
    fillRecycleChosen(first, 0, x, feedPath, 0, cm);
    if (shared) fillRecycleChosen(later, 0, x, feedPath, "all", cm);
    else for (let i = 0; i < m; i++) fillRecycleChosen(later, i * m, x, pathFrom(basis, false, x, i), i, cm);
    return { first, later };
  }
  const ratio = recycle.ratio;
  fillRecycleFixed(basis, true, first, 0, x, 0, feedPath, ratio, cm);
  for (let i = 0; i < m; i++) fillRecycleFixed(basis, false, later, i * m, x, i, shared ? feedPath : pathFrom(basis, false, x, i), ratio, cm);
  return { first, later };
}

/** Builds the grid tables (m points from 0 to the target); the tube with recycle's only when used. */
export function buildGridTables(basis: SizingBasis, cm: CostModel, target: number, m: number, recycle: RecycleGrid = { used: false, ratio: null }): GridTables {
  if (basis.choice) return buildChosenTemperatureTables(basis, cm, target, m, recycle);
  const x = uniformGrid(target, m);
  const first = { CSTR: new Float64Array(m), PFR: new Float64Array(m) };
  const later = { CSTR: new Float64Array(m * m), PFR: new Float64Array(m * m) };
  const feedPath = pathFrom(basis, true, x, 0);
  fillRow(first, 0, x, 0, feedPath, 0, cm);
  if (sharedPath(basis)) {
    // One path serves every stage: a later stage's volume is a difference of cumulative values. With no
    // rate at the feed the first cell's integral is infinite; the sums then start after it, and a tube from
    // x_0 stays infinite (its base is -Infinity).
    const idleFeed = !Number.isFinite(feedPath.segment[1]);
    const cumulative = idleFeed ? feedPath.segment.map((_, j) => (j === 0 ? -Infinity : 0)) : feedPath.cumulative;
    if (idleFeed) for (let j = 2; j < m; j++) cumulative[j] = cumulative[j - 1] + feedPath.segment[j];
    for (let i = 0; i < m; i++) {
      const shifted = { height: feedPath.height, cumulative, segment: feedPath.segment };
      fillRow(later, i * m, x, i, shifted, cumulative[i], cm);
    }
  } else {
    for (let i = 0; i < m; i++) fillRow(later, i * m, x, i, pathFrom(basis, false, x, i), 0, cm);
  }
  const withRecycle = recycle.used ? fillRecycle(basis, recycle, x, feedPath, cm) : { first: new Float64Array(0), later: new Float64Array(0) };
  return { m, x, first: { ...first, "PFR-recycle": withRecycle.first }, later: { ...later, "PFR-recycle": withRecycle.later } };
}
