/**
 * What the live charts of a model of several reactions draw and read out, from the engine's paths
 * (single tube and single stirred tanks from the feed): the series of the concentration path and of the
 * instantaneous selectivity, and the best product concentration with the residence time where it
 * occurs. Pure; concentrations come in mol/m3 and go out in the unit the engineer reads.
 */
import type { LineSeries } from "@/components/charts/line-chart";
import { fromSI } from "@/lib/units/display";

/** One point of a path, as the engine's `networkPaths` gives it (contract of issue 13). */
export interface PathPointView {
  residenceTime: number;
  conversion: number;
  key: number;
  product: number | null;
  selectivity: number | null;
  steadyState?: number;
}

export interface PathsView {
  key: string;
  product: string | null;
  tube: PathPointView[];
  tanks: PathPointView[];
}

export interface Best {
  /** C_product there, mol/m3. */
  product: number;
  residenceTime: number;
  conversion: number;
}

/**
 * Where the product's concentration is highest along a path; null without a product. The drawn points
 * are a grid, so the peak is refined by the parabola through the best point and its two neighbours
 * (when it is not at an end): the readout then hardly depends on where the grid happens to fall.
 */
export function bestProduct(points: PathPointView[]): Best | null {
  const pts = points.filter((p) => p.product !== null && Number.isFinite(p.product)).sort((a, b) => a.residenceTime - b.residenceTime);
  if (pts.length === 0) return null;
  let i = 0;
  pts.forEach((p, j) => {
    if (p.product! > pts[i]!.product!) i = j;
  });
  const b = pts[i]!;
  const best: Best = { product: b.product!, residenceTime: b.residenceTime, conversion: b.conversion };
  if (i === 0 || i === pts.length - 1) return best;
  const a = pts[i - 1]!;
  const c = pts[i + 1]!;
  // In ln τ where the grid allows (the engine's grid is log-spaced, and a peak is rounder there).
  const logScale = a.residenceTime > 0;
  const x = (t: number) => (logScale ? Math.log(t) : t);
  const peak = parabolaPeak([x(a.residenceTime), a.product!], [x(b.residenceTime), b.product!], [x(c.residenceTime), c.product!]);
  const vertex = peak && { x: logScale ? Math.exp(peak.x) : peak.x, y: peak.y };
  if (!vertex || !(vertex.x > a.residenceTime && vertex.x < c.residenceTime) || vertex.y < best.product) return best;
  // Conversion at the refined time, read linearly from the neighbouring points.
  const [lo, hi] = vertex.x < b.residenceTime ? [a, b] : [b, c];
  const f = (vertex.x - lo.residenceTime) / (hi.residenceTime - lo.residenceTime);
  return { product: vertex.y, residenceTime: vertex.x, conversion: lo.conversion + f * (hi.conversion - lo.conversion) };
}

/** The vertex of the parabola through three points, or null when they are on a line. */
function parabolaPeak(p: [number, number], q: [number, number], r: [number, number]): { x: number; y: number } | null {
  const [x1, y1] = p;
  const [x2, y2] = q;
  const [x3, y3] = r;
  const d = (x1 - x2) * (x1 - x3) * (x2 - x3);
  const A = (x3 * (y2 - y1) + x2 * (y1 - y3) + x1 * (y3 - y2)) / d;
  const B = (x3 * x3 * (y1 - y2) + x2 * x2 * (y3 - y1) + x1 * x1 * (y2 - y3)) / d;
  const C = (x2 * x3 * (x2 - x3) * y1 + x3 * x1 * (x3 - x1) * y2 + x1 * x2 * (x1 - x2) * y3) / d;
  if (!(A < 0) || !Number.isFinite(A)) return null;
  const x = -B / (2 * A);
  return { x, y: C - (B * B) / (4 * A) };
}

/**
 * The residence time at which a path first reaches a conversion, interpolated linearly between its
 * points; null when the drawn path never gets there.
 */
export function residenceTimeAt(points: PathPointView[], conversion: number): number | null {
  const sorted = [...points].sort((a, b) => a.residenceTime - b.residenceTime);
  for (let i = 0; i < sorted.length; i++) {
    const p = sorted[i]!;
    if (p.conversion < conversion) continue;
    if (i === 0) return p.residenceTime;
    const a = sorted[i - 1]!;
    const f = (conversion - a.conversion) / (p.conversion - a.conversion);
    return a.residenceTime + f * (p.residenceTime - a.residenceTime);
  }
  return null;
}

/** A time unit that keeps the drawn residence times readable: seconds, minutes or hours. */
export function timeUnitFor(longest: number): "s" | "min" | "h" {
  if (longest < 300) return "s";
  if (longest < 18000) return "min";
  return "h";
}

const conc = (si: number, unit: string) => fromSI("concentration", si, unit);
const time = (si: number, unit: string) => fromSI("time", si, unit);

/** A tank with several steady states at its size shows every state; the train continues from state 0. */
const otherState = (p: PathPointView) => (p.steadyState ?? 0) > 0;

/**
 * The concentration path: C_product against C_key for the single tube and the single stirred tanks, the
 * tanks' further steady states as marks. Without a product, C_key against residence time instead.
 */
export function pathSeries(paths: PathsView, concUnit: string, timeUnit: string): LineSeries[] {
  const withProduct = paths.product !== null;
  const xy = (p: PathPointView) => (withProduct ? { x: conc(p.key, concUnit), y: conc(p.product ?? NaN, concUnit) } : { x: time(p.residenceTime, timeUnit), y: conc(p.key, concUnit) });
  const tanks = paths.tanks.filter((p) => !otherState(p));
  const others = paths.tanks.filter(otherState);
  const series: LineSeries[] = [
    { id: "tube", label: "Single tube", points: paths.tube.map(xy), tone: { stage: 1 } },
    { id: "tanks", label: "Single stirred tanks", points: tanks.map(xy), tone: { stage: 0 } },
  ];
  if (others.length) series.push({ id: "states", label: "Further steady states of a tank", points: others.map(xy), tone: { stage: 0 }, markers: true, line: false });
  return series;
}

/** The instantaneous selectivity along the tube against C_key (points where the key reactant is not consumed left out). */
export function selectivitySeries(paths: PathsView, concUnit: string): LineSeries[] {
  const points = paths.tube.filter((p) => p.selectivity !== null && Number.isFinite(p.selectivity)).map((p) => ({ x: conc(p.key, concUnit), y: p.selectivity! }));
  return [{ id: "tube-selectivity", label: "Single tube", points, tone: { stage: 1 } }];
}

/** Lowest selectivity drawn: below it the wanted product is used up faster than the key reactant, and the curve would flatten the rest. */
export const SELECTIVITY_FLOOR = -1;

/** The selectivity axis: from the floor (or 0) to 1 or the highest value, and whether points below the floor were cut. */
export function selectivityRange(series: LineSeries[]): { range: [number, number]; cut: boolean } {
  const ys = series.flatMap((s) => s.points.map((p) => p.y)).filter(Number.isFinite);
  const lo = Math.min(0, ...ys);
  const hi = Math.max(1, ...ys);
  return { range: [Math.max(lo, SELECTIVITY_FLOOR), hi * 1.04], cut: lo < SELECTIVITY_FLOOR };
}
