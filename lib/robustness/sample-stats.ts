/**
 * Summaries of sampled values: percentiles (linear between order statistics), the mean and a
 * histogram of equal bins. Pure.
 */
import type { SampledDistribution } from "@/lib/schemas/robustness";

/** The p-quantile of sorted values, interpolated between neighbours. */
export function quantile(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) return NaN;
  const h = (sorted.length - 1) * p;
  const lo = Math.floor(h);
  return sorted[lo] + (h - lo) * ((sorted[Math.min(lo + 1, sorted.length - 1)] ?? sorted[lo]) - sorted[lo]);
}

/** `bins` equal bins from the least to the greatest value; all in one bin when every value is the same. */
export function histogram(sorted: readonly number[], bins = 20): SampledDistribution["histogram"] {
  if (sorted.length === 0) return [];
  const lo = sorted[0];
  const hi = sorted[sorted.length - 1];
  if (!(hi > lo)) return [{ from: lo, to: hi, count: sorted.length }];
  const width = (hi - lo) / bins;
  const out = Array.from({ length: bins }, (_, i) => ({ from: lo + i * width, to: i === bins - 1 ? hi : lo + (i + 1) * width, count: 0 }));
  for (const v of sorted) out[Math.min(bins - 1, Math.floor((v - lo) / width))].count++;
  return out;
}

/** Percentiles 5/50/95, mean and histogram of the values (sorted here, in place). */
export function distributionOf(values: number[], bins = 20): SampledDistribution {
  values.sort((a, b) => a - b);
  return {
    p5: quantile(values, 0.05),
    p50: quantile(values, 0.5),
    p95: quantile(values, 0.95),
    mean: values.reduce((a, b) => a + b, 0) / Math.max(1, values.length),
    histogram: histogram(values, bins),
  };
}
