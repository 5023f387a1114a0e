/**
 * One way to print the ticks of an axis, for every chart: all ticks of one axis share one
 * notation, so "1.00e+6" never sits beside "500,000". Ticks of 100,000 and above, or all below
 * 0.01, are written as a multiple of one power of ten (0.5e6, 1e6); the rest plainly, with as
 * many decimals as the step between ticks needs.
 */
export function tickFormatter(ticks: readonly number[]): (v: number) => string {
  const finite = ticks.filter(Number.isFinite);
  const nonZero = finite.filter((t) => t !== 0).map(Math.abs);
  if (!nonZero.length) return (v) => (v === 0 ? "0" : String(v));
  const largest = Math.max(...nonZero);
  if (largest >= 1e5 || largest < 1e-2) {
    const e = Math.floor(Math.log10(largest));
    return (v) => (v === 0 ? "0" : `${Number((v / 10 ** e).toPrecision(3))}e${e}`);
  }
  const sorted = [...new Set(finite)].sort((a, b) => a - b);
  const step = sorted.length > 1 ? Math.min(...sorted.slice(1).map((t, i) => t - sorted[i]!)) : largest;
  const decimals = Math.min(6, Math.max(0, -Math.floor(Math.log10(step) + 1e-9)));
  return (v) => v.toLocaleString("en-US", { minimumFractionDigits: decimals, maximumFractionDigits: decimals });
}
