import type { CostModel } from "./cost";
import { fillRecycleChosen, fillRecycleFixed, fillRow, pathFrom, uniformGrid, type GridTables, type Path, type RecycleGrid } from "./grid-tables";
import type { SizingBasis, TemperatureBounds } from "./sizing-basis";
import { stageBasisAt } from "./stage-temperature";

/**
 * Inlet temperatures tried per stage in the grid tables. The tables only choose the basin of the optimum
 * over the conversions and the refinement's start; the refinement takes each stage at its exact best
 * temperature (stage-temperature.ts).
 */
export const GRID_TEMPERATURES = 25;

function temperatures(range: TemperatureBounds): number[] {
  const [lo, hi] = range;
  if (!(hi > lo)) return [lo];
  return Array.from({ length: GRID_TEMPERATURES }, (_, q) => (q === GRID_TEMPERATURES - 1 ? hi : lo + ((hi - lo) * q) / (GRID_TEMPERATURES - 1)));
}

type Kind = "CSTR" | "PFR" | "PFR-recycle";

type Row = Record<Kind, Float64Array>;

function newRow(m: number): Row {
  return { CSTR: new Float64Array(m), PFR: new Float64Array(m), "PFR-recycle": new Float64Array(m) };
}

/** One row of every table (a stage from x_i) on one temperature path, written into `row`. */
function rowOnPath(row: Row, basis: SizingBasis, first: boolean, x: Float64Array, i: number, path: Path, cm: CostModel, recycle: RecycleGrid): Row {
  fillRow(row, 0, x, i, path, 0, cm);
  if (recycle.used) {
    if (recycle.ratio === null) fillRecycleChosen(row["PFR-recycle"], 0, x, path, i, cm);
    else fillRecycleFixed(basis, first, row["PFR-recycle"], 0, x, i, path, recycle.ratio, cm);
  }
  return row;
}

/**
 * Row i of the tables: the least objective over the inlet temperatures tried when the stage's inlet is
 * chosen (a path per temperature), else on the stage's given path.
 */
function bestRow(basis: SizingBasis, first: boolean, range: TemperatureBounds | null, x: Float64Array, i: number, cm: CostModel, recycle: RecycleGrid): Row {
  const m = x.length;
  if (!range) return rowOnPath(newRow(m), basis, first, x, i, pathFrom(basis, first, x, i), cm, recycle);
  const best = newRow(m);
  const scratch = newRow(m);
  let firstTemperature = true;
  for (const t of temperatures(range)) {
    const at = stageBasisAt(basis, t);
    const row = rowOnPath(firstTemperature ? best : scratch, at, false, x, i, pathFrom(at, false, x, i), cm, recycle);
    if (!firstTemperature) for (const k of KINDS) for (let j = i; j < m; j++) if (row[k][j] < best[k][j]) best[k][j] = row[k][j];
    firstTemperature = false;
  }
  return best;
}

const KINDS: readonly Kind[] = ["CSTR", "PFR", "PFR-recycle"];

/**
 * Grid tables when stage inlet temperatures are chosen: each entry is the least over GRID_TEMPERATURES
 * inlet temperatures evenly spread over the stage's range (each path stops where the stage would pass the
 * maximum temperature or its equilibrium), O(temperatures x m^2) rate evaluations.
 */
export function buildChosenTemperatureTables(basis: SizingBasis, cm: CostModel, target: number, m: number, recycle: RecycleGrid): GridTables {
  const x = uniformGrid(target, m);
  const choice = basis.choice ?? { first: null, later: null };
  const first = bestRow(basis, true, choice.first, x, 0, cm, recycle);
  const later: Record<Kind, Float64Array> = { CSTR: new Float64Array(m * m), PFR: new Float64Array(m * m), "PFR-recycle": new Float64Array(recycle.used ? m * m : 0) };
  for (let i = 0; i < m; i++) {
    const row = bestRow(basis, false, choice.later, x, i, cm, recycle);
    later.CSTR.set(row.CSTR, i * m);
    later.PFR.set(row.PFR, i * m);
    if (recycle.used) later["PFR-recycle"].set(row["PFR-recycle"], i * m);
  }
  if (!recycle.used) first["PFR-recycle"] = new Float64Array(0);
  return { m, x, first, later };
}
