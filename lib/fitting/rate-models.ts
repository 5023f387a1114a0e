import { Matrix, solve } from "ml-matrix";
import { fitLeastSquares, type LeastSquaresFit } from "./least-squares";

/** R, J/(mol K) (CODATA 2018 exact value). */
const GAS_CONSTANT = 8.314462618;

/** One measured point: concentrations in mol/m3, rate -rA in mol/(m3 s), temperature in K. */
export interface RatePoint {
  concA: number;
  /** Product concentration, for reversible laws. */
  concR?: number;
  temperature?: number;
  rate: number;
}

export type RateModelKind = "power" | "reversible" | "saturation" | "saturation-inhibition" | "power-arrhenius";

export interface RateFit extends LeastSquaresFit {
  kind: RateModelKind;
  /** Formula in words and symbols, for the screens and the report. */
  formula: string;
  /** Reference temperature of an Arrhenius fit, K. */
  referenceTemperature?: number;
  /** [measured, fitted] pairs for a parity plot. */
  parity: [number, number][];
}

/** Straight-line least squares y = a + b x, for starting values. */
function line(x: number[], y: number[]): { a: number; b: number } {
  const n = x.length;
  const mx = x.reduce((s, v) => s + v, 0) / n;
  const my = y.reduce((s, v) => s + v, 0) / n;
  let sxy = 0;
  let sxx = 0;
  for (let i = 0; i < n; i++) {
    sxy += (x[i] - mx) * (y[i] - my);
    sxx += (x[i] - mx) ** 2;
  }
  const b = sxx > 0 ? sxy / sxx : 0;
  return { a: my - b * mx, b };
}

function requirePositive(points: RatePoint[], what: "rate" | "concA") {
  if (points.some((p) => !(p[what] > 0))) throw new Error(`every point needs a positive ${what === "rate" ? "rate" : "concentration of A"} for this law`);
}

/**
 * Fits one rate law to measured points. Starting values come from the law's usual
 * linearisation (log-log for a power law, double reciprocal for saturation), so no guesses
 * are asked of the user.
 */
export function fitRateModel(kind: RateModelKind, points: RatePoint[]): RateFit {
  const observed = points.map((p) => p.rate);
  const C = points.map((p) => p.concA);
  let fit: LeastSquaresFit;
  let formula: string;
  let referenceTemperature: number | undefined;

  switch (kind) {
    case "power": {
      requirePositive(points, "rate");
      requirePositive(points, "concA");
      const start = line(C.map(Math.log), observed.map(Math.log));
      formula = "-rA = k·C_A^n";
      fit = fitLeastSquares({
        names: ["k", "n"],
        observed,
        initial: [Math.exp(start.a), start.b],
        scale: [Math.exp(start.a), 1],
        predict: ([k, n], i) => k * C[i] ** n,
        gradient: ([k, n], i) => [C[i] ** n, k * C[i] ** n * Math.log(C[i])],
      });
      break;
    }
    case "reversible": {
      const R = points.map((p) => {
        if (p.concR === undefined) throw new Error("a reversible fit needs the product concentration of every point");
        return p.concR;
      });
      // -rA = kf C_A - kr C_R is linear in (kf, kr): the normal equations give the start exactly.
      const saa = C.reduce((s, c) => s + c * c, 0);
      const srr = R.reduce((s, r) => s + r * r, 0);
      const sar = C.reduce((s, c, i) => s + c * R[i], 0);
      const say = C.reduce((s, c, i) => s + c * observed[i], 0);
      const sry = R.reduce((s, r, i) => s + r * observed[i], 0);
      const det = saa * srr - sar * sar;
      const kf = (say * srr - sry * sar) / det;
      const kr = -(saa * sry - sar * say) / det;
      formula = "-rA = kf·C_A − kr·C_R";
      fit = fitLeastSquares({
        names: ["kf", "kr"],
        observed,
        initial: [kf, kr],
        scale: [Math.abs(kf) || 1, Math.abs(kr) || Math.abs(kf) || 1],
        predict: ([f, r], i) => f * C[i] - r * R[i],
        gradient: (_p, i) => [C[i], -R[i]],
      });
      break;
    }
    case "saturation":
    case "saturation-inhibition": {
      requirePositive(points, "rate");
      requirePositive(points, "concA");
      // Double reciprocal: 1/r = 1/vmax + (km/vmax)(1/C).
      const lb = line(C.map((c) => 1 / c), observed.map((r) => 1 / r));
      const vmax = lb.a > 0 ? 1 / lb.a : Math.max(...observed) * 2;
      const km = lb.a > 0 ? Math.max(lb.b / lb.a, 1e-12) : Math.max(...C);
      if (kind === "saturation") {
        formula = "-rA = vmax·C_A / (km + C_A)";
        fit = fitLeastSquares({
          names: ["vmax", "km"],
          observed,
          initial: [vmax, km],
          predict: ([v, k], i) => (v * C[i]) / (k + C[i]),
          gradient: ([v, k], i) => [C[i] / (k + C[i]), (-v * C[i]) / (k + C[i]) ** 2],
        });
      } else {
        formula = "-rA = vmax·C_A / (km + C_A + C_A²/ki)";
        // 1/r = (km/vmax)(1/C) + 1/vmax + C/(vmax ki): linear in three coefficients.
        const X = new Matrix(C.map((c) => [1 / c, 1, c]));
        const coef = solve(X.transpose().mmul(X), X.transpose().mmul(Matrix.columnVector(observed.map((r) => 1 / r)))).to1DArray();
        const [a, b, q] = coef;
        const start = b > 0 && a > 0 && q > 0 ? [1 / b, a / b, b / q] : [vmax, km, Math.max(...C) * 10];
        fit = fitLeastSquares({
          names: ["vmax", "km", "ki"],
          observed,
          initial: start,
          predict: ([v, k, q], i) => (v * C[i]) / (k + C[i] + (C[i] * C[i]) / q),
          gradient: ([v, k, q], i) => {
            const d = k + C[i] + (C[i] * C[i]) / q;
            return [C[i] / d, (-v * C[i]) / (d * d), (v * C[i] * C[i] * C[i]) / (q * q * d * d)];
          },
        });
      }
      break;
    }
    case "power-arrhenius": {
      requirePositive(points, "rate");
      requirePositive(points, "concA");
      const T = points.map((p) => {
        if (!(p.temperature && p.temperature > 0)) throw new Error("an Arrhenius fit needs the temperature of every point");
        return p.temperature;
      });
      if (new Set(T).size < 2) throw new Error("an Arrhenius fit needs points at two temperatures or more");
      // Centre 1/T so k_ref and Ea are nearly uncorrelated.
      const tRef = T.length / T.reduce((s, t) => s + 1 / t, 0);
      referenceTemperature = tRef;
      const u = T.map((t) => 1 / t - 1 / tRef);
      // ln r = ln k_ref − (Ea/R) u + n ln C: two separate lines give the start.
      const n0 = line(C.map(Math.log), observed.map(Math.log)).b;
      const e0 = line(u, observed.map((r, i) => Math.log(r) - n0 * Math.log(C[i])));
      formula = "-rA = k_ref·exp(−Ea/R·(1/T − 1/T_ref))·C_A^n";
      const model = (k: number, ea: number, n: number, i: number) => k * Math.exp((-ea / GAS_CONSTANT) * u[i]) * C[i] ** n;
      fit = fitLeastSquares({
        names: ["k_ref", "Ea", "n"],
        observed,
        initial: [Math.exp(e0.a), -e0.b * GAS_CONSTANT, n0],
        scale: [Math.exp(e0.a), Math.max(Math.abs(e0.b * GAS_CONSTANT), 1000), 1],
        predict: ([k, ea, n], i) => model(k, ea, n, i),
        gradient: ([k, ea, n], i) => {
          const r = model(k, ea, n, i);
          return [r / k, (-u[i] / GAS_CONSTANT) * r, r * Math.log(C[i])];
        },
      });
      break;
    }
  }
  return {
    ...fit,
    kind,
    formula,
    ...(referenceTemperature !== undefined ? { referenceTemperature } : {}),
    parity: observed.map((y, i) => [y, fit.predicted[i]]),
  };
}
