import { tickFormatter } from "./tick-format";

/**
 * Round tick values for a nivo axis from `min` to `max` (about `count` of them), with the one
 * formatter they all share. nivo formats each tick on its own, so a chart that let it pick ticks
 * and format them one by one could print "1.00e+6" beside "500,000"; fixing the values here lets
 * the whole axis use one notation (tick-format.ts).
 */
export function axisTicks(min: number, max: number, count = 5): { tickValues: number[]; format: (v: number | string | Date) => string } {
  if (!Number.isFinite(min) || !Number.isFinite(max) || !(max > min)) {
    const only = Number.isFinite(min) ? [min] : [0];
    const f = tickFormatter(only);
    return { tickValues: only, format: (v) => f(Number(v)) };
  }
  const raw = (max - min) / count;
  const p = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * p).find((s) => s >= raw * (1 - 1e-12)) ?? 10 * p;
  const tickValues: number[] = [];
  // Whole multiples of the step, rounded so 0.1 + 0.2 never prints as 0.30000000000000004.
  for (let i = Math.ceil(min / step - 1e-9); i * step <= max * (1 + Math.sign(max) * 1e-9); i++) {
    tickValues.push(Number((i * step).toPrecision(12)) || 0);
  }
  const f = tickFormatter(tickValues);
  return { tickValues, format: (v) => f(Number(v)) };
}
