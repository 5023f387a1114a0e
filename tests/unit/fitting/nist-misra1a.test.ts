import { readFileSync } from "node:fs";
import { describe, expect, it } from "vitest";
import { fitLeastSquares } from "@/lib/fitting/least-squares";

// NIST Statistical Reference Datasets, nonlinear regression, Misra1a (lower difficulty):
// y = b1 (1 - exp(-b2 x)); certified values copied with the data in nist-misra1a.csv.
const CERTIFIED = { b1: 2.3894212918e2, b2: 5.5015643181e-4, se1: 2.7070075241, se2: 7.2668688436e-6, rss: 1.2455138894e-1 };

const rows = readFileSync(new URL("./nist-misra1a.csv", import.meta.url), "utf8")
  .split("\n")
  .filter((l) => /^\d/.test(l))
  .map((l) => l.split(",").map(Number));
const x = rows.map((r) => r[0]);
const y = rows.map((r) => r[1]);

describe("least squares against NIST StRD Misra1a", () => {
  const fit = fitLeastSquares({
    names: ["b1", "b2"],
    observed: y,
    initial: [500, 1e-4], // NIST start 1
    predict: ([b1, b2], i) => b1 * (1 - Math.exp(-b2 * x[i])),
    gradient: ([b1, b2], i) => [1 - Math.exp(-b2 * x[i]), b1 * x[i] * Math.exp(-b2 * x[i])],
  });

  it("reaches the certified parameters and residual sum of squares", () => {
    expect(fit.status).toBe("converged");
    expect(fit.parameters[0].value).toBeCloseTo(CERTIFIED.b1, 6); // certified to 11 digits; 1e-6 absolute on 239
    expect(Math.abs(fit.parameters[1].value / CERTIFIED.b2 - 1)).toBeLessThan(1e-8);
    expect(Math.abs(fit.residualSumOfSquares / CERTIFIED.rss - 1)).toBeLessThan(1e-8);
  });

  it("reaches the certified standard errors", () => {
    expect(Math.abs(fit.parameters[0].standardError / CERTIFIED.se1 - 1)).toBeLessThan(1e-6);
    expect(Math.abs(fit.parameters[1].standardError / CERTIFIED.se2 - 1)).toBeLessThan(1e-6);
  });

  it("gives a 95 % interval from Student's t with n - p = 12 degrees of freedom", () => {
    // t(0.975, 12) = 2.178813 (statistical tables, from memory).
    const [lo, hi] = fit.parameters[0].interval95;
    expect((hi - lo) / (2 * fit.parameters[0].standardError)).toBeCloseTo(2.178813, 5);
    expect(fit.degreesOfFreedom).toBe(12);
  });
});
