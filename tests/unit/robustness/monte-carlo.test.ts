import { describe, expect, it } from "vitest";
import { rateUnderUncertainty } from "@/lib/robustness/monte-carlo";

// One CSTR, first order: X = k tau / (1 + k tau) (closed form, common practice). With k uniform
// on [a, b], X is monotone in k, so the p-quantile of X is that formula at k_p = a + p (b - a),
// and P(X < x) = (x / (tau (1 - x)) - a) / (b - a).
const FA0 = 0.02;
const CA0 = 1000;
const V = 0.5; // m3
const tau = V / (FA0 / CA0); // s
const [a, b] = [4e-5, 1.2e-4]; // 1/s
const xAt = (k: number) => (k * tau) / (1 + k * tau);

const spec = {
  feed: { flowA: FA0, concA: CA0 },
  reaction: { rate: { law: "power" as const, k: 8e-5, orders: { A: 1 } } },
  stages: [{ type: "CSTR" as const, volume: V }],
};

describe("Monte Carlo rating against the closed-form distribution of a first-order CSTR", () => {
  const n = 20000;
  const target = 0.65;
  const result = rateUnderUncertainty({ spec, uncertain: [{ field: "reaction.rate.k", kind: "uniform", low: a, high: b }], target, samples: n, seed: 42 });

  it("gives the percentiles within their sampling error", () => {
    for (const [p, got] of [
      [0.05, result.p5],
      [0.5, result.p50],
      [0.95, result.p95],
    ] as const) {
      // Sampling error of a quantile ≈ sqrt(p(1-p)/n) / f(x_p); in k-space f = 1/(b-a), mapped through dX/dk.
      const k = a + p * (b - a);
      const dxdk = tau / (1 + k * tau) ** 2;
      const se = (Math.sqrt((p * (1 - p)) / n) * (b - a)) * dxdk;
      expect(Math.abs(got - xAt(k))).toBeLessThan(4 * se);
    }
  });

  it("gives the probability of missing the target within four standard errors", () => {
    const kTarget = target / (tau * (1 - target));
    const exact = (kTarget - a) / (b - a);
    expect(Math.abs(result.probabilityOfMissingTarget - exact)).toBeLessThan(4 * Math.sqrt((exact * (1 - exact)) / n));
    expect(result.refusedSamples).toBe(0);
  });

  it("is reproducible for a seed and changes with it", () => {
    const again = rateUnderUncertainty({ spec, uncertain: [{ field: "reaction.rate.k", kind: "uniform", low: a, high: b }], target, samples: 500, seed: 7 });
    const same = rateUnderUncertainty({ spec, uncertain: [{ field: "reaction.rate.k", kind: "uniform", low: a, high: b }], target, samples: 500, seed: 7 });
    const other = rateUnderUncertainty({ spec, uncertain: [{ field: "reaction.rate.k", kind: "uniform", low: a, high: b }], target, samples: 500, seed: 8 });
    expect(same).toEqual(again);
    expect(other.p50).not.toBe(again.p50);
  });

  it("a ±fraction is taken around the spec's own value", () => {
    const r = rateUnderUncertainty({ spec, uncertain: [{ field: "reaction.rate.k", kind: "plusMinus", fraction: 0.5 }], target, samples: 4000, seed: 1 });
    // ±50 % around 8e-5 is exactly [4e-5, 1.2e-4]: the same closed-form median.
    expect(Math.abs(r.p50 - xAt(8e-5))).toBeLessThan(0.01);
  });
});
