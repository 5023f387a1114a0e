import { stageObjective, type CostModel } from "./cost";
import { sharedPath, type SizingBasis } from "./sizing-basis";
import { levenspielHeight, temperatureFeasible } from "./stages";
import type { StageType } from "./types";

/**
 * Objective of every stage between two points of a conversion grid, computed once and shared by all
 * sequences: first[type][j] for a first stage 0 -> x_j, later[type][i*m + j] for a later stage x_i -> x_j.
 */
export interface GridTables {
  readonly m: number;
  readonly x: Float64Array;
  readonly first: Readonly<Record<StageType, Float64Array>>;
  readonly later: Readonly<Record<StageType, Float64Array>>;
}

function uniformGrid(target: number, m: number): Float64Array {
  const x = new Float64Array(m);
  for (let j = 0; j < m; j++) x[j] = (target * j) / (m - 1);
  x[m - 1] = target;
  return x;
}

/** Heights FA0/(-rA) and cumulative PFR volumes along the path of a stage that starts at x[i]. */
function pathFrom(basis: SizingBasis, first: boolean, x: Float64Array, i: number) {
  const m = x.length;
  const a = x[i];
  const height = new Float64Array(m).fill(Infinity);
  const cumulative = new Float64Array(m).fill(Infinity);
  height[i] = levenspielHeight(basis, first, a, a);
  cumulative[i] = 0;
  for (let j = i + 1; j < m; j++) {
    if (!temperatureFeasible(basis, first, a, x[j])) break;
    height[j] = levenspielHeight(basis, first, a, x[j]);
    if (!Number.isFinite(height[j])) break;
    // Simpson's rule per cell, reusing the heights at the grid points: the tables only have to pick the
    // basin of the optimum and a start for the refinement, which works at full precision.
    const mid = levenspielHeight(basis, first, a, 0.5 * (x[j - 1] + x[j]));
    cumulative[j] = cumulative[j - 1] + ((x[j] - x[j - 1]) / 6) * (height[j - 1] + 4 * mid + height[j]);
  }
  return { height, cumulative };
}

function fillRow(
  out: Record<StageType, Float64Array>,
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
    const pfr = path.cumulative[j] - baseVolume;
    out.CSTR[k] = stageObjective(cm, "CSTR", cstr);
    out.PFR[k] = stageObjective(cm, "PFR", pfr);
  }
}

/** Builds the grid tables (m points from 0 to the target). */
export function buildGridTables(basis: SizingBasis, cm: CostModel, target: number, m: number): GridTables {
  const x = uniformGrid(target, m);
  const first = { CSTR: new Float64Array(m), PFR: new Float64Array(m) };
  const later = { CSTR: new Float64Array(m * m), PFR: new Float64Array(m * m) };
  const feedPath = pathFrom(basis, true, x, 0);
  fillRow(first, 0, x, 0, feedPath, 0, cm);
  if (sharedPath(basis)) {
    // One path serves every stage: a later stage's volume is a difference of cumulative values.
    for (let i = 0; i < m; i++) {
      const shifted = { height: feedPath.height, cumulative: feedPath.cumulative };
      fillRow(later, i * m, x, i, shifted, feedPath.cumulative[i], cm);
    }
  } else {
    for (let i = 0; i < m; i++) fillRow(later, i * m, x, i, pathFrom(basis, false, x, i), 0, cm);
  }
  return { m, x, first, later };
}
