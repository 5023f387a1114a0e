import { levenbergMarquardt } from "ml-levenberg-marquardt";
import { inverse, Matrix, solve } from "ml-matrix";
import tQuantile from "@stdlib/stats-base-dists-t-quantile";

/** A model with its Jacobian, over observations indexed 0..n-1. */
export interface LeastSquaresProblem {
  /** Parameter names, in order. */
  names: string[];
  /** Predicted value of observation i for parameters p. */
  predict: (p: number[], i: number) => number;
  /** d predict / d p_j for observation i. */
  gradient: (p: number[], i: number) => number[];
  /** Observed values. */
  observed: number[];
  /** Starting values. */
  initial: number[];
  /** Typical magnitude of each parameter (default |initial|), so every scaled parameter is near 1. */
  scale?: number[];
}

export interface FittedParameter {
  name: string;
  value: number;
  standardError: number;
  /** 95 % confidence interval from the linearised covariance and Student's t. */
  interval95: [number, number];
}

export interface LeastSquaresFit {
  parameters: FittedParameter[];
  residualSumOfSquares: number;
  /** Coefficient of determination, 1 - RSS/TSS. */
  rSquared: number;
  /** Residual standard deviation sqrt(RSS/(n-p)). */
  residualStandardDeviation: number;
  degreesOfFreedom: number;
  predicted: number[];
  residuals: number[];
  iterations: number;
  /** "converged" when the last Gauss-Newton polish changed the RSS by less than 1e-14 relative. */
  status: "converged" | "max-iterations";
}

function rss(problem: LeastSquaresProblem, p: number[]): number {
  let s = 0;
  for (let i = 0; i < problem.observed.length; i++) {
    const r = problem.observed[i] - problem.predict(p, i);
    s += r * r;
  }
  return s;
}

function jacobian(problem: LeastSquaresProblem, p: number[]): Matrix {
  return new Matrix(problem.observed.map((_, i) => problem.gradient(p, i)));
}

/**
 * Gauss-Newton steps with step halving from a point near the optimum, to full precision:
 * the Levenberg-Marquardt search stops at a loose tolerance of its own.
 */
function polish(problem: LeastSquaresProblem, start: number[], maxSteps = 50): { p: number[]; steps: number; converged: boolean } {
  let p = start;
  let current = rss(problem, p);
  for (let step = 0; step < maxSteps; step++) {
    const j = jacobian(problem, p);
    const r = Matrix.columnVector(problem.observed.map((y, i) => y - problem.predict(p, i)));
    let delta: number[];
    try {
      delta = solve(j.transpose().mmul(j), j.transpose().mmul(r)).to1DArray();
    } catch {
      return { p, steps: step, converged: false };
    }
    let t = 1;
    let next = p.map((v, k) => v + delta[k]);
    let nextRss = rss(problem, next);
    while (!(nextRss <= current) && t > 1e-10) {
      t /= 2;
      next = p.map((v, k) => v + t * delta[k]);
      nextRss = rss(problem, next);
    }
    if (!(nextRss <= current)) return { p, steps: step, converged: true };
    const gain = (current - nextRss) / Math.max(current, Number.MIN_VALUE);
    p = next;
    current = nextRss;
    if (gain < 1e-14) return { p, steps: step + 1, converged: true };
  }
  return { p, steps: maxSteps, converged: false };
}

/**
 * Nonlinear least squares: Levenberg-Marquardt (ml-levenberg-marquardt) on scaled parameters
 * for the search, a Gauss-Newton polish for full precision, then the usual linearised
 * statistics: covariance s^2 (J'J)^-1 with s^2 = RSS/(n-p), standard errors, and 95 %
 * intervals from Student's t with n-p degrees of freedom.
 */
export function fitLeastSquares(problem: LeastSquaresProblem): LeastSquaresFit {
  const n = problem.observed.length;
  const k = problem.names.length;
  if (n <= k) throw new Error(`need more observations (${n}) than parameters (${k})`);
  const scale = problem.scale ?? problem.initial.map((v) => (v === 0 ? 1 : Math.abs(v)));
  const toP = (u: ArrayLike<number>) => Array.from(u, (v, j) => v * scale[j]);
  const index = Array.from({ length: n }, (_, i) => i);

  const lm = levenbergMarquardt(
    { x: index, y: problem.observed },
    (u) => (i) => problem.predict(toP(u), i),
    {
      initialValues: problem.initial.map((v, j) => v / scale[j]),
      jacobianFunction: (u: number[]) => (i: number) => problem.gradient(toP(u), i).map((g, j) => g * scale[j]),
      damping: 1e-3,
      // The search only needs to reach the basin; the Gauss-Newton polish below finishes the job.
      maxIterations: 40,
      errorTolerance: 1e-12,
      improvementThreshold: 1e-6,
    },
  );
  const { p, steps, converged } = polish(problem, toP(lm.parameterValues));

  const predicted = index.map((i) => problem.predict(p, i));
  const residuals = problem.observed.map((y, i) => y - predicted[i]);
  const residualSumOfSquares = residuals.reduce((s, r) => s + r * r, 0);
  const mean = problem.observed.reduce((s, y) => s + y, 0) / n;
  const total = problem.observed.reduce((s, y) => s + (y - mean) ** 2, 0);
  const dof = n - k;
  const s2 = residualSumOfSquares / dof;
  const j = jacobian(problem, p);
  const covariance = inverse(j.transpose().mmul(j)).mul(s2);
  const t = tQuantile(0.975, dof);
  return {
    parameters: problem.names.map((name, m) => {
      const standardError = Math.sqrt(Math.max(0, covariance.get(m, m)));
      return { name, value: p[m], standardError, interval95: [p[m] - t * standardError, p[m] + t * standardError] };
    }),
    residualSumOfSquares,
    rSquared: total > 0 ? 1 - residualSumOfSquares / total : 1,
    residualStandardDeviation: Math.sqrt(s2),
    degreesOfFreedom: dof,
    predicted,
    residuals,
    iterations: lm.iterations + steps,
    status: converged ? "converged" : "max-iterations",
  };
}
