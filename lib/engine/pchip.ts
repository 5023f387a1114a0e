/** A monotone piecewise-cubic Hermite interpolant (Fritsch–Carlson slopes). */
export interface Pchip {
  readonly x: readonly number[];
  readonly y: readonly number[];
  readonly d: readonly number[];
}

function endSlope(h0: number, h1: number, del0: number, del1: number): number {
  // Three-point end formula, kept shape-preserving (Fritsch and Carlson; Moler, Numerical Computing with MATLAB, ch. 3).
  const d = ((2 * h0 + h1) * del0 - h0 * del1) / (h0 + h1);
  if (Math.sign(d) !== Math.sign(del0)) return 0;
  if (Math.sign(del0) !== Math.sign(del1) && Math.abs(d) > Math.abs(3 * del0)) return 3 * del0;
  return d;
}

/** Builds the interpolant; x strictly increasing, at least two points. */
export function buildPchip(x: readonly number[], y: readonly number[]): Pchip {
  const n = x.length;
  const h = x.slice(1).map((v, i) => v - x[i]);
  const del = h.map((hi, i) => (y[i + 1] - y[i]) / hi);
  if (n === 2) return { x, y, d: [del[0], del[0]] };
  const d = new Array<number>(n).fill(0);
  for (let k = 1; k < n - 1; k++) {
    if (del[k - 1] * del[k] > 0) {
      const w1 = 2 * h[k] + h[k - 1];
      const w2 = h[k] + 2 * h[k - 1];
      d[k] = (w1 + w2) / (w1 / del[k - 1] + w2 / del[k]);
    }
  }
  d[0] = endSlope(h[0], h[1], del[0], del[1]);
  d[n - 1] = endSlope(h[n - 2], h[n - 3], del[n - 2], del[n - 3]);
  return { x, y, d };
}

/** Evaluates the interpolant; NaN outside [x0, xn] (never extrapolates). */
export function evaluatePchip(p: Pchip, t: number): number {
  const { x, y, d } = p;
  const n = x.length;
  if (!(t >= x[0] && t <= x[n - 1])) return Number.NaN;
  let lo = 0;
  let hi = n - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (x[mid] <= t) lo = mid;
    else hi = mid;
  }
  const h = x[hi] - x[lo];
  const s = (t - x[lo]) / h;
  const s2 = s * s;
  const s3 = s2 * s;
  return (
    (2 * s3 - 3 * s2 + 1) * y[lo] + (s3 - 2 * s2 + s) * h * d[lo] + (-2 * s3 + 3 * s2) * y[hi] + (s3 - s2) * h * d[hi]
  );
}
