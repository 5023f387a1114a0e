import type { SizingBasis } from "./sizing-basis";
import { levenspielHeight } from "./stages";
import type { PlotPoint, StagePlot, StageType } from "./types";

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

/** Levenspiel plot data of one stage: its curve FA0/(-rA) against X and the outline of its volume. */
export function stagePlot(basis: SizingBasis, type: StageType, first: boolean, a: number, b: number): StagePlot {
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
