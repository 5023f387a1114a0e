/**
 * The comparison of trains of several reactions: each measure, and how far each train is from the
 * best of those compared (yield and selectivity: below the largest; volume: above the smallest).
 * Pure, so a test can hold the differences against the rows.
 */
import type { NetworkStageResult } from "@/lib/engine";

export interface NetworkCompareInput {
  id: string;
  totalVolume: number | null;
  conversion?: number | null;
  yield?: number | null;
  selectivity?: number | null;
  product?: string | null;
  stages: NetworkStageResult[];
  feasible: boolean;
}

export interface NetworkCompareRow {
  id: string;
  /** Fraction below the largest yield of those compared (0 for the best; null without a yield). */
  yieldBelowBest: number | null;
  selectivityBelowBest: number | null;
  /** m3 above the smallest total volume (0 for the smallest). */
  volumeOverBest: number | null;
  /** The wanted product's concentration leaving the last stage, mol/m3. */
  productOutlet: number | null;
}

const best = (values: (number | null | undefined)[], pick: (...n: number[]) => number) => {
  const finite = values.filter((v): v is number => typeof v === "number" && Number.isFinite(v));
  return finite.length ? pick(...finite) : null;
};

export function compareNetworkTrains(list: NetworkCompareInput[]): NetworkCompareRow[] {
  const feasible = list.filter((c) => c.feasible);
  const topYield = best(feasible.map((c) => c.yield), Math.max);
  const topSelectivity = best(feasible.map((c) => c.selectivity), Math.max);
  const leastVolume = best(feasible.map((c) => c.totalVolume), Math.min);
  const below = (v: number | null | undefined, top: number | null) => (typeof v === "number" && top !== null ? top - v : null);
  return list.map((c) => {
    const last = c.stages[c.stages.length - 1];
    return {
      id: c.id,
      yieldBelowBest: c.feasible ? below(c.yield, topYield) : null,
      selectivityBelowBest: c.feasible ? below(c.selectivity, topSelectivity) : null,
      volumeOverBest: c.feasible && c.totalVolume !== null && leastVolume !== null ? c.totalVolume - leastVolume : null,
      productOutlet: c.product && last ? (last.outlet[c.product] ?? null) : null,
    };
  });
}
