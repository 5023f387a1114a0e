/**
 * ISO 3 preferred numbers, series R10 (ratio 10^(1/10)), as the standard rounds them:
 * 1.00 1.25 1.60 2.00 2.50 3.15 4.00 5.00 6.30 8.00, repeated in every decade.
 */
export const R10 = [1.0, 1.25, 1.6, 2.0, 2.5, 3.15, 4.0, 5.0, 6.3, 8.0] as const;

/** Standard vessel volumes (m3) of the R10 series from `min` to `max`, both included when they are members. */
export function r10Sizes(min = 0.1, max = 100): number[] {
  const out: number[] = [];
  for (let decade = Math.floor(Math.log10(min)) - 1; decade <= Math.ceil(Math.log10(max)); decade++) {
    for (const m of R10) {
      const v = Number((m * 10 ** decade).toPrecision(3));
      if (v >= min * (1 - 1e-12) && v <= max * (1 + 1e-12)) out.push(v);
    }
  }
  return out;
}
