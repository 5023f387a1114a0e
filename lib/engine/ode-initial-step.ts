/**
 * First trial step of an ODE integration when the caller gives none (Hairer & Wanner, Solving ODE I,
 * Sect. II.4): large enough not to waste steps, small enough that the error control rarely rejects it.
 */

/** Hairer & Wanner's starting-step heuristic: one explicit Euler probe estimates the second derivative. */
export function initialStep(
  evalF: (t: number, y: Float64Array, out: Float64Array) => void,
  t: number,
  y: Float64Array,
  f0: Float64Array,
  atol: Float64Array,
  rtol: number,
  order: number,
): number {
  const n = y.length;
  let d0 = 0;
  let d1 = 0;
  const sk = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    sk[i] = atol[i] + rtol * Math.abs(y[i]);
    d0 += (y[i] / sk[i]) ** 2;
    d1 += (f0[i] / sk[i]) ** 2;
  }
  d0 = Math.sqrt(d0 / n);
  d1 = Math.sqrt(d1 / n);
  const h0 = d0 < 1e-5 || d1 < 1e-5 ? 1e-6 : 0.01 * (d0 / d1);
  const y1 = new Float64Array(n);
  for (let i = 0; i < n; i++) y1[i] = y[i] + h0 * f0[i];
  const f1 = new Float64Array(n);
  evalF(t + h0, y1, f1);
  let d2 = 0;
  for (let i = 0; i < n; i++) d2 += ((f1[i] - f0[i]) / sk[i]) ** 2;
  d2 = Math.sqrt(d2 / n) / h0;
  const big = Math.max(d1, d2);
  const h1 = big <= 1e-15 || !Number.isFinite(big) ? Math.max(1e-6, h0 * 1e-3) : (0.01 / big) ** (1 / (order + 1));
  return Math.min(100 * h0, h1);
}
