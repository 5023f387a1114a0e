import type { SizingBasis } from "./sizing-basis";
import { levenspielHeight } from "./stages";
import { recycleInletConversion, recycleVolume } from "./recycle";
import type { PlotPoint, StagePlot, TrainStageType } from "./types";

/** Points of a stage's curve; enough for a smooth plot, few enough to keep results small. */
export const CURVE_POINTS = 25;

// Powers of ten 10^-330 .. 10^330 by table: rounding thousands of plot points per request should not cost a pow each.
const POW10 = Array.from({ length: 661 }, (_, i) => Number(`1e${i - 330}`));

/** v rounded to 6 significant digits. */
function round(v: number): number {
  if (!Number.isFinite(v) || v === 0) return v;
  const e = 5 - Math.floor(Math.log10(Math.abs(v)));
  if (e < -300 || e > 300) return v;
  const scale = POW10[e + 330];
  return Math.round(v * scale) / scale;
}

/** Points of the curve FA0/(-rA) from lo to hi on the path of a stage that starts at a; heights that are not finite are left out. */
function curvePoints(basis: SizingBasis, first: boolean, a: number, lo: number, hi: number): PlotPoint[] {
  const n = hi > lo ? CURVE_POINTS : 1;
  const out: PlotPoint[] = [];
  for (let i = 0; i < n; i++) {
    const x = n === 1 ? lo : lo + ((hi - lo) * i) / (n - 1);
    const h = levenspielHeight(basis, first, a, x);
    if (Number.isFinite(h)) out.push([round(x), round(h)]);
  }
  return out;
}

/**
 * A tube with recycle: the curve over the whole stage [a, b], the rectangle over [a, b] whose height is the
 * tube's mean FA0/(-rA) (its area is the volume), and the area under the curve the tube integrates, from its
 * mixed inlet X_1 to b, which stretched by (R + 1) is that rectangle. A zero rate at the stage's inlet
 * (autocatalysis from a pure feed) has no finite height there; the curve starts where it has one.
 */
function recyclePlot(basis: SizingBasis, first: boolean, a: number, b: number, ratio: number): StagePlot {
  const x1 = recycleInletConversion(a, b, ratio);
  const volume = recycleVolume(basis, first, a, b, ratio);
  const mean = round(b > a ? volume / (b - a) : levenspielHeight(basis, first, a, b));
  const under = curvePoints(basis, first, a, x1, b);
  return {
    curve: curvePoints(basis, first, a, a, b),
    area: [[round(a), 0], [round(a), mean], [round(b), mean], [round(b), 0]],
    recycle: { recycleRatio: ratio, inletConversion: x1, underCurve: [[round(x1), 0], ...under, [round(b), 0]] },
  };
}

/**
 * Levenspiel plot data of one stage: its curve FA0/(-rA) against X and the outline of its volume;
 * `recycleRatio` is a tube with recycle's R (required for that type).
 */
export function stagePlot(basis: SizingBasis, type: TrainStageType, first: boolean, a: number, b: number, recycleRatio?: number): StagePlot {
  if (type === "PFR-recycle") return recyclePlot(basis, first, a, b, recycleRatio ?? 0);
  const n = b > a ? CURVE_POINTS : 1;
  const curve: PlotPoint[] = [];
  for (let i = 0; i < n; i++) {
    const x = n === 1 ? a : a + ((b - a) * i) / (n - 1);
    curve.push([round(x), round(levenspielHeight(basis, first, a, x))]);
  }
  if (type === "CSTR") {
    const h = round(levenspielHeight(basis, first, a, b));
    return { curve, area: [[round(a), 0], [round(a), h], [round(b), h], [round(b), 0]] };
  }
  return { curve, area: [[round(a), 0], ...curve, [round(b), 0]] };
}
