/**
 * Dense output of the stiff integrator: values between the ends of an accepted step, for requested
 * output points and for locating a stopping condition. Cubic Hermite interpolation from the end values
 * and slopes is order 3 and keeps the slope continuous; it needs no method-specific coefficients.
 */

/** Appends the dense-output values at the requested points up to and including upTo; returns the next index. */
export function pushOutputs(
  outputs: { t: number; y: Float64Array }[],
  times: readonly number[],
  from: number,
  upTo: number,
  dense: (t: number, out: Float64Array) => void,
  n: number,
): number {
  let i = from;
  for (; i < times.length && times[i] <= upTo; i++) {
    const y = new Float64Array(n);
    dense(times[i], y);
    outputs.push({ t: times[i], y });
  }
  return i;
}

/** Cubic Hermite interpolation on [t0, t0 + h] from the end values and slopes (order 3, continuous slope). */
export function hermite(t0: number, h: number, y0: Float64Array, y1: Float64Array, f0: Float64Array, f1: Float64Array, t: number, out: Float64Array) {
  const th = (t - t0) / h;
  const th1 = th - 1;
  for (let i = 0; i < y0.length; i++) {
    const dy = y1[i] - y0[i];
    out[i] = (1 - th) * y0[i] + th * y1[i] + th * th1 * ((1 - 2 * th) * dy + th1 * h * f0[i] + th * h * f1[i]);
  }
}

/**
 * The first point in (lo, hi] where the predicate holds, given that it fails at lo and holds at hi:
 * bisection on the dense output down to round-off (at most 60 halvings). A condition that turns true
 * and false again within one step is not seen; the caller bounds the step if that matters.
 */
export function locateFirstTrue(
  predicate: (t: number, y: Float64Array) => boolean,
  lo: number,
  hi: number,
  yHi: Float64Array,
  dense: (t: number, out: Float64Array) => void,
): { t: number; y: Float64Array } {
  const n = yHi.length;
  const end = hi;
  const probe = new Float64Array(n);
  for (let i = 0; i < 60 && hi - lo > 4 * Number.EPSILON * Math.max(Math.abs(lo), Math.abs(hi)); i++) {
    const mid = 0.5 * (lo + hi);
    dense(mid, probe);
    if (predicate(mid, probe)) hi = mid;
    else lo = mid;
  }
  const y = new Float64Array(n);
  if (hi === end) y.set(yHi);
  else dense(hi, y);
  return { t: hi, y };
}
