/** Kinetic fitting: nonlinear least squares with linearised statistics, and the rate laws it fits. */
export { fitLeastSquares, type FittedParameter, type LeastSquaresFit, type LeastSquaresProblem } from "./least-squares";
export { fitRateModel, type RateFit, type RateModelKind, type RatePoint } from "./rate-models";
