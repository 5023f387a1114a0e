/**
 * Jacobians of y' = f(t, y) by finite differences, for the stiff integrator when the caller gives none.
 * J is n x n, row-major: J[i * n + j] = d f_i / d y_j. f0 holds f(t, y); y is restored on return.
 *
 * Increments scale with S, the largest |y_k|, so the same problem in mol/m3 or kmol/m3 takes the same
 * steps; a floor proportional to S keeps round-off from the large concentrations in the same rate
 * expression from swamping the difference for a species that is nearly absent.
 */
type Evaluate = (t: number, y: Float64Array, out: Float64Array) => void;

const EPS = Number.EPSILON;
const CBRT_EPS = Math.cbrt(EPS);

function largestMagnitude(y: Float64Array): number {
  let scale = 0;
  for (let j = 0; j < y.length; j++) scale = Math.max(scale, Math.abs(y[j]));
  return scale > 0 && Number.isFinite(scale) ? scale : 1;
}

/**
 * Forward differences, increments sqrt(eps * S * max(|y_j|, 1e-5 S)): Hairer & Wanner's
 * sqrt(eps * max(|y_j|, 1e-5)) made independent of the unit. One evaluation per column, but an error of
 * order sqrt(eps) relative to the largest rate term: enough to spoil the small determinant of a fast
 * equilibrium's block, where the slow rate lives (tests/unit/engine/stiff-ode.test.ts, bench/stiff-ode.bench.ts).
 */
export function forwardDifferenceJacobian(evalF: Evaluate, t: number, y: Float64Array, f0: Float64Array, J: Float64Array, scratch: Float64Array): void {
  const n = y.length;
  const scale = largestMagnitude(y);
  for (let j = 0; j < n; j++) {
    const saved = y[j];
    y[j] = saved + Math.sqrt(EPS * scale * Math.max(1e-5 * scale, Math.abs(saved)));
    const delta = y[j] - saved; // the increment actually representable, not the one asked for
    evalF(t, y, scratch);
    y[j] = saved;
    for (let i = 0; i < n; i++) J[i * n + j] = (scratch[i] - f0[i]) / delta;
  }
}

/**
 * Second-order differences, increments eps^(1/3) * max(|y_j|, 1e-3 S): two evaluations per column, an
 * error of order eps^(2/3) relative to the largest rate term, and exact for rate terms quadratic in one
 * concentration (mass action) whatever the increment. A species within one increment of zero is probed
 * on its positive side only (three-point one-sided formula), so a rate law that clamps at C = 0 is
 * never differenced across its kink.
 */
export function centralDifferenceJacobian(
  evalF: Evaluate,
  t: number,
  y: Float64Array,
  f0: Float64Array,
  J: Float64Array,
  scratch: Float64Array,
  scratch2: Float64Array,
): void {
  const n = y.length;
  const scale = largestMagnitude(y);
  for (let j = 0; j < n; j++) {
    const saved = y[j];
    const delta = CBRT_EPS * Math.max(Math.abs(saved), 1e-3 * scale);
    const oneSided = Math.abs(saved) < delta;
    y[j] = saved + delta;
    const up = y[j] - saved;
    evalF(t, y, scratch);
    y[j] = oneSided ? saved + 2 * delta : saved - delta;
    const other = y[j] - saved;
    evalF(t, y, scratch2);
    y[j] = saved;
    if (oneSided) {
      // Derivative at 0 of the parabola through (0, f0), (up, f+), (other, f++), written with differences
      // from f0: the three weights sum to zero, and summing them separately would leave eps * f0 / delta.
      const w1 = other / (up * (other - up));
      const w2 = -up / (other * (other - up));
      for (let i = 0; i < n; i++) J[i * n + j] = w1 * (scratch[i] - f0[i]) + w2 * (scratch2[i] - f0[i]);
    } else {
      for (let i = 0; i < n; i++) J[i * n + j] = (scratch[i] - scratch2[i]) / (up - other);
    }
  }
}
