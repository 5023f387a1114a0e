/**
 * Geometry of a Levenspiel area chart: FA0/(-rA) against conversion X, each CSTR the rectangle of
 * height FA0/(-rA) at its outlet over its conversion span, each PFR the area under the curve over
 * its span, each tube with recycle the rectangle over its span at the mean height of the curve over
 * its tube (from the mixed inlet X_1 to the outlet), drawn with that area under the curve.
 * Pure: numbers in m3 in, polygons in m3 out; the chart scales them to the display unit.
 */
import type { PlotPoint, StageResult } from "@/lib/engine";

export type Point = PlotPoint;

/** What the chart needs of a designed stage (volume in m3). */
export type ChartStageBasis = Pick<StageResult, "type" | "conversionIn" | "conversionOut" | "volume">;

/** A tube with recycle's plot data as the engine gives it (StagePlot.recycle). */
export interface ChartRecycle {
  recycleRatio: number;
  /** X_1, the conversion at the tube's inlet after the recycle is mixed in. */
  inletConversion: number;
  /** The engine's outline of the area under the curve from X_1 to the outlet (optional). */
  underCurve?: Point[];
}

export interface ChartStage extends ChartStageBasis {
  /** The engine's outline of the stage (optional); a PFR's top then follows its own temperature path. */
  area?: Point[];
  /** A tube with recycle only. */
  recycle?: ChartRecycle;
}

/** A tube with recycle's area under the curve over its tube, [X_1, X_out]: (R + 1) times it is the stage volume. */
export interface UnderCurve {
  recycleRatio: number;
  inletConversion: number;
  /** Closed outline, counter-clockwise from (X_1, 0). */
  polygon: Point[];
  /** Shoelace area of the outline, m3: the stage volume / (R + 1). */
  area: number;
}

export interface StagePolygon extends ChartStageBasis {
  index: number;
  /** Closed outline, counter-clockwise from (X_in, 0): base, right side, top, left side. */
  polygon: Point[];
  /** Shoelace area of the outline, m3. */
  area: number;
  /**
   * Factor applied to the outline's heights so that its area is the stage volume: 1 for a CSTR;
   * for a PFR the ratio of the volume to the trapezoid area of the sampled curve (near 1).
   */
  heightScale: number;
  /** Height of the top at the outlet, m3 (a CSTR's rectangle height). */
  outletHeight: number;
  /** A tube with recycle only: the area under the curve its tube integrates. */
  underCurve?: UnderCurve;
}

export interface ChartGeometry {
  stages: StagePolygon[];
  /** Curve points within the plotted conversion range, sorted by X. */
  curve: Point[];
  xMax: number;
  yMax: number;
}

/** Signed area by the shoelace formula (positive when counter-clockwise). */
export function shoelace(polygon: Point[]): number {
  let s = 0;
  for (let i = 0; i < polygon.length; i++) {
    const [x1, y1] = polygon[i];
    const [x2, y2] = polygon[(i + 1) % polygon.length];
    s += x1 * y2 - x2 * y1;
  }
  return s / 2;
}

/** Linear interpolation of a curve sorted by X; clamps at its ends. */
export function interpolate(curve: Point[], x: number): number {
  if (curve.length === 0) return 0;
  if (x <= curve[0][0]) return curve[0][1];
  const last = curve[curve.length - 1];
  if (x >= last[0]) return last[1];
  let lo = 0;
  let hi = curve.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (curve[mid][0] <= x) lo = mid;
    else hi = mid;
  }
  const [x0, y0] = curve[lo];
  const [x1, y1] = curve[hi];
  return x1 === x0 ? y1 : y0 + ((y1 - y0) * (x - x0)) / (x1 - x0);
}

/** Sorted, de-duplicated copy of the curve (the last point of equal X wins). */
export function sortCurve(curve: Point[]): Point[] {
  const sorted = curve.filter(([x, y]) => Number.isFinite(x) && Number.isFinite(y)).sort((a, b) => a[0] - b[0]);
  const out: Point[] = [];
  for (const p of sorted) {
    if (out.length && out[out.length - 1][0] === p[0]) out[out.length - 1] = p;
    else out.push(p);
  }
  return out;
}

/**
 * Monotone cubic (Fritsch-Carlson) through the points in log height: the curve FA0/(-rA) rises
 * steeply towards equilibrium or full conversion, and a log-cubic follows it far closer than chords.
 */
export function smoothCurve(curve: Point[]): (x: number) => number {
  const pts = sortCurve(curve).filter(([, y]) => y > 0);
  if (pts.length < 3) return (x) => interpolate(curve, x);
  const xs = pts.map(([x]) => x);
  const ys = pts.map(([, y]) => Math.log(y));
  const n = xs.length;
  const d = xs.slice(1).map((x, i) => (ys[i + 1] - ys[i]) / (x - xs[i]));
  // Ends: the three-point estimate, kept to the sign of the end chord.
  const end = (h0: number, h1: number, d0: number, d1: number) => {
    const v = ((2 * h0 + h1) * d0 - h0 * d1) / (h0 + h1);
    if (Math.sign(v) !== Math.sign(d0)) return 0;
    if (Math.sign(d0) !== Math.sign(d1) && Math.abs(v) > Math.abs(3 * d0)) return 3 * d0;
    return v;
  };
  const m = xs.map((_, i) => {
    if (i === 0) return end(xs[1] - xs[0], xs[2] - xs[1], d[0], d[1]);
    if (i === n - 1) return end(xs[n - 1] - xs[n - 2], xs[n - 2] - xs[n - 3], d[n - 2], d[n - 3]);
    if (d[i - 1] * d[i] <= 0) return 0;
    const h0 = xs[i] - xs[i - 1];
    const h1 = xs[i + 1] - xs[i];
    return (3 * (h0 + h1)) / ((2 * h1 + h0) / d[i - 1] + (h1 + 2 * h0) / d[i]);
  });
  return (x) => {
    if (x <= xs[0] || x >= xs[n - 1]) return interpolate(pts, x);
    let i = 0;
    while (i < n - 2 && xs[i + 1] < x) i++;
    const h = xs[i + 1] - xs[i];
    const t = (x - xs[i]) / h;
    const t2 = t * t;
    const t3 = t2 * t;
    const v = (2 * t3 - 3 * t2 + 1) * ys[i] + (t3 - 2 * t2 + t) * h * m[i] + (-2 * t3 + 3 * t2) * ys[i + 1] + (t3 - t2) * h * m[i + 1];
    return Math.exp(v);
  };
}

/** Points of a PFR's top per stage: enough for the outline to follow the curve closely. */
const PFR_TOP_POINTS = 200;

/**
 * The top of a PFR over [a, b]: the stage's own outline when given, else the curve, sampled densely.
 * `own` overrides the stage's outline (a tube with recycle's area under the curve).
 */
function pfrTop(stage: ChartStage, curve: Point[], points: number, a = stage.conversionIn, ownOutline: Point[] | undefined = stage.area): Point[] {
  const b = stage.conversionOut;
  const own = ownOutline?.filter(([, y]) => y > 0) ?? [];
  const f = smoothCurve(own.length >= 2 ? own : curve);
  if (!(b > a)) return [[a, f(a)]];
  return Array.from({ length: points + 1 }, (_, i) => {
    const x = a + ((b - a) * i) / points;
    return [x, f(x)] as Point;
  });
}

/**
 * The polygon of one stage, with heights scaled so that its area is exactly the stage volume.
 * `topPoints`: samples of a PFR's top (a thumbnail a hundred pixels wide needs far fewer).
 */
export function stagePolygon(stage: ChartStage, curve: Point[], index = 0, topPoints = PFR_TOP_POINTS): StagePolygon {
  const a = stage.conversionIn;
  const b = stage.conversionOut;
  const span = b - a;
  let top: Point[];
  let heightScale = 1;
  let underCurve: UnderCurve | undefined;
  if (stage.type === "PFR-recycle") {
    // Design equation of the tube with recycle (Levenspiel, ch. 6): V = (X_out - X_in) × the mean of FA0/(-rA)
    // over [X_1, X_out], so the rectangle over the stage's span at that mean height has the volume as its area,
    // and the area under the curve over [X_1, X_out] is V / (R + 1).
    const h = span > 0 ? stage.volume / span : interpolate(curve, b);
    top = [[a, h], [b, h]];
    if (stage.recycle) underCurve = recycleUnderCurve(stage, stage.recycle, curve, topPoints);
  } else if (stage.type === "CSTR") {
    // The rectangle's height is FA0/(-rA) at the outlet; its area over the span is the volume.
    // A stage of zero span (the optimum may leave a stage empty) keeps the curve's height, with zero area.
    const ownH = stage.area?.find(([, y]) => y > 0)?.[1];
    const h = span > 0 ? stage.volume / span : (ownH ?? interpolate(curve, b));
    top = [[a, h], [b, h]];
  } else {
    const raw = pfrTop(stage, curve, topPoints);
    const rawArea = shoelace([[a, 0], [b, 0], ...[...raw].reverse()]);
    heightScale = rawArea > 0 ? stage.volume / rawArea : 1;
    top = raw.map(([x, y]) => [x, y * heightScale]);
  }
  // Counter-clockwise: along the base, up the outlet side, back along the top, down the inlet side.
  const polygon: Point[] = [[a, 0], [b, 0], ...[...top].reverse()];
  return {
    index,
    type: stage.type,
    conversionIn: a,
    conversionOut: b,
    volume: stage.volume,
    polygon,
    area: shoelace(polygon),
    heightScale,
    outletHeight: top[top.length - 1][1],
    ...(underCurve ? { underCurve } : {}),
  };
}

/**
 * The area under the curve over a tube with recycle's tube, [X_1, X_out], its heights scaled (as a PFR's are)
 * so that its area is the stage volume / (R + 1) exactly.
 */
function recycleUnderCurve(stage: ChartStage, recycle: ChartRecycle, curve: Point[], topPoints: number): UnderCurve {
  const x1 = recycle.inletConversion;
  const b = stage.conversionOut;
  const raw = pfrTop(stage, curve, topPoints, x1, recycle.underCurve);
  const rawArea = shoelace([[x1, 0], [b, 0], ...[...raw].reverse()]);
  const wanted = stage.volume / (recycle.recycleRatio + 1);
  const scale = rawArea > 0 ? wanted / rawArea : 1;
  const polygon: Point[] = [[x1, 0], [b, 0], ...raw.map(([x, y]) => [x, y * scale] as Point).reverse()];
  return { recycleRatio: recycle.recycleRatio, inletConversion: x1, polygon, area: shoelace(polygon) };
}

/** Everything the chart draws, in m3, with the axis extents. */
export function chartGeometry(input: { curve: Point[]; stages: ChartStage[]; target?: number; equilibrium?: number | null; yMax?: number; topPoints?: number }): ChartGeometry {
  const stageCurve = input.stages.flatMap((s) => (s.area ?? []).filter(([, y]) => y > 0));
  const curve = sortCurve(input.curve.length ? input.curve : stageCurve);
  const stages = input.stages.map((s, i) => stagePolygon(s, curve, i, input.topPoints));
  const lastOut = Math.max(0, ...input.stages.map((s) => s.conversionOut));
  const xEnd = Math.max(lastOut, input.target ?? 0, curve.length ? curve[curve.length - 1][0] : 0);
  // Leave a little room right of the last stage; an equilibrium limit just beyond it is shown too.
  let xMax = Math.min(1, xEnd * 1.05 || 1);
  if (input.equilibrium && input.equilibrium > xEnd && input.equilibrium < 1) xMax = Math.min(1, Math.max(xMax, input.equilibrium * 1.02));
  const visible = curve.filter(([x]) => x <= xMax);
  const heights = [...visible.map(([, y]) => y), ...stages.flatMap((s) => [...s.polygon, ...(s.underCurve?.polygon ?? [])].map(([, y]) => y))];
  const yMax = input.yMax && input.yMax > 0 ? input.yMax : niceCeil(Math.max(0, ...heights.filter(Number.isFinite)) * 1.05 || 1);
  return { stages, curve: visible, xMax, yMax };
}

/** The smallest 1, 2, 2.5 or 5 times a power of ten at or above v. */
export function niceCeil(v: number): number {
  if (!(v > 0)) return 1;
  const p = 10 ** Math.floor(Math.log10(v));
  for (const m of [1, 1.2, 1.5, 2, 2.5, 3, 4, 5, 6, 8, 10]) if (m * p >= v * (1 - 1e-12)) return m * p;
  return 10 * p;
}

/** Evenly spaced round tick values from 0 to max (about `count` of them). */
export function ticks(max: number, count = 5): number[] {
  if (!(max > 0)) return [0];
  const raw = max / count;
  const p = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * p).find((s) => s >= raw) ?? 10 * p;
  const out: number[] = [];
  for (let v = 0; v <= max * (1 + 1e-9); v += step) out.push(Number(v.toPrecision(12)));
  return out;
}

/** Largest height any of several candidates' charts reaches, m3: one shared scale for side-by-side charts. */
export function sharedYMax(charts: { curve: Point[]; stages: ChartStage[]; target?: number; topPoints?: number }[]): number {
  return Math.max(...charts.map((c) => chartGeometry({ ...c }).yMax), 0) || 1;
}
