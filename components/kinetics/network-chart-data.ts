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

/** Where the product's concentration is highest along a path (the first such point); null without a product. */
export function bestProduct(points: PathPointView[]): Best | null {
  let best: Best | null = null;
  for (const p of points) {
    if (p.product === null || !Number.isFinite(p.product)) continue;
    if (!best || p.product > best.product) best = { product: p.product, residenceTime: p.residenceTime, conversion: p.conversion };
  }
  return best;
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
