import type { OdeFunction } from "../../lib/engine/stiff-ode";

/**
 * Robertson's chemical kinetics problem, the classic stiff test (rate constants spanning nine decades),
 * with its exact Jacobian: shared by the integrator's checks and its benchmark.
 */
export const robertson: OdeFunction = (_t, y, d) => {
  d[0] = -0.04 * y[0] + 1e4 * y[1] * y[2];
  d[2] = 3e7 * y[1] * y[1];
  d[1] = -d[0] - d[2];
};

export const robertsonJacobian = (_t: number, y: Float64Array, J: number[][]) => {
  J[0][0] = -0.04;
  J[0][1] = 1e4 * y[2];
  J[0][2] = 1e4 * y[1];
  J[1][0] = 0.04;
  J[1][1] = -1e4 * y[2] - 6e7 * y[1];
  J[1][2] = -1e4 * y[1];
  J[2][1] = 6e7 * y[1];
};
