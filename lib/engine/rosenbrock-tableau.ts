/**
 * Coefficients of RODAS4, the L-stable, stiffly accurate Rosenbrock-Wanner method of order 4 with an
 * embedded order-3 solution (Hairer & Wanner, Solving Ordinary Differential Equations II, Sect. IV.7).
 *
 * The numbers are from memory. They are checked, not trusted: tests/unit/engine/stiff-ode.test.ts
 * converts them back to the standard Rosenbrock form and verifies the eight order-4 conditions and
 * the four order-3 conditions of the embedded solution (Hairer & Wanner II, Table IV.7.1) to round-off,
 * L-stability (R(z) -> 0 as z -> -infinity), and the observed convergence order on problems with a
 * closed-form solution.
 *
 * They are given in the "transformed" form, which avoids a matrix-vector product with the Jacobian
 * per stage. With E = I / (h gamma) - J, each stage k_i solves
 *   E k_i = f(t + alpha_i h, y + sum_j a_ij k_j) + sum_j (c_ij / h) k_j + h d_i df/dt
 * and the new solution is y + sum_i m_i k_i, the embedded one y + sum_i mHat_i k_i.
 */
export interface RosenbrockTableau {
  /** Number of stages. */
  readonly stages: number;
  /** The diagonal coefficient gamma, shared by all stages so that one LU serves the whole step. */
  readonly gamma: number;
  /** Classical order of the main solution; the error estimate is one order lower. */
  readonly order: number;
  /** a[i][j], j < i: how earlier stages enter the argument of f in stage i (transformed form). */
  readonly a: readonly (readonly number[])[];
  /** c[i][j], j < i: how earlier stages enter the right-hand side of stage i (transformed form). */
  readonly c: readonly (readonly number[])[];
  /** alpha_i: where in the step stage i evaluates f (fraction of h). */
  readonly alpha: readonly number[];
  /** d_i = sum_j gamma_ij: weight of the time derivative of f in stage i (non-autonomous problems). */
  readonly d: readonly number[];
  /** Weights of the new solution. */
  readonly m: readonly number[];
  /** Weights of the embedded solution used only to estimate the error. */
  readonly mHat: readonly number[];
}

const a51 = 1.221224509226641;
const a52 = 6.019134481288629;
const a53 = 12.53708332932087;
const a54 = -0.687886036105895;

/**
 * RODAS4 (from memory; see the checks named above). Stages 5 and 6 evaluate f at the end of the step:
 * stage 5 at the embedded solution's argument, stage 6 at the embedded solution itself, so the method
 * is stiffly accurate (the new solution is the last stage's argument plus k6) and k6 is the error estimate.
 */
export const RODAS4: RosenbrockTableau = {
  stages: 6,
  gamma: 0.25,
  order: 4,
  a: [
    [],
    [1.544],
    [0.9466785280815826, 0.2557011698983284],
    [3.314825187068521, 2.896124015972201, 0.9986419139977817],
    [a51, a52, a53, a54],
    [a51, a52, a53, a54, 1],
  ],
  c: [
    [],
    [-5.6688],
    [-2.430093356833875, -0.2063599157091915],
    [-0.1073529058151375, -9.594562251023355, -20.47028614809616],
    [7.496443313967647, -10.24680431464352, -33.99990352819905, 11.7089089320616],
    [8.083246795921522, -7.981132988064893, -31.52159432874371, 16.31930543123136, -6.058818238834054],
  ],
  alpha: [0, 0.386, 0.21, 0.63, 1, 1],
  d: [0.25, -0.1043, 0.1035, -0.0362, 0, 0],
  m: [a51, a52, a53, a54, 1, 1],
  mHat: [a51, a52, a53, a54, 1, 0],
};
