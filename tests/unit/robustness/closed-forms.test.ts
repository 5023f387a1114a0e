import { describe, expect, it } from "vitest";
import { rateUnderUncertainty } from "@/lib/robustness/monte-carlo";

// First-order, isothermal, liquid: closed forms of the outlet conversion (common practice):
//   PFR:                         X = 1 - exp(-k tau)
//   N equal CSTRs in series:     X = 1 - (1 + k tau_i)^-N
// X rises with k, so with k uniform on [a, b], P(X < x*) = P(k < k*) = (k* - a) / (b - a), k* the k
// at which X = x* (exact, from the uniform CDF). The Monte Carlo fraction must be within 4 standard errors.
const FA0 = 0.02; // mol/s
const CA0 = 1000; // mol/m3
const v0 = FA0 / CA0; // m3/s
const [a, b] = [6e-4, 1.4e-3]; // 1/s
const n = 20000;

function check(result: ReturnType<typeof rateUnderUncertainty>, kStar: number) {
  const exact = (kStar - a) / (b - a);
  const se = Math.sqrt((exact * (1 - exact)) / n);
  expect(exact).toBeGreaterThan(0.1);
  expect(exact).toBeLessThan(0.9);
  expect(Math.abs(result.probabilityOfMissingTarget - exact)).toBeLessThan(4 * se);
  expect(result.refusedSamples).toBe(0);
}

describe("Monte Carlo against closed forms with uniform k", () => {
  it("first-order PFR: P(X < x*) = P(k < -ln(1 - x*) / tau)", () => {
    const tau = 2300; // s, so k tau spans about 1.4..3.2
    const V = tau * v0; // m3
    const target = 0.9;
    const r = rateUnderUncertainty({
      spec: { feed: { flowA: FA0, concA: CA0 }, reaction: { rate: { law: "power", k: 1e-3, orders: { A: 1 } } }, stages: [{ type: "PFR", volume: V }] },
      uncertain: [{ field: "reaction.rate.k", kind: "uniform", low: a, high: b }],
      target,
      samples: n,
      seed: 2026,
    });
    check(r, -Math.log(1 - target) / tau);
    // The median sample is the closed form at the median k.
    expect(Math.abs(r.p50 - (1 - Math.exp(-((a + b) / 2) * tau)))).toBeLessThan(0.005);
  });

  for (const N of [2, 3, 5]) {
    it(`${N} equal first-order CSTRs: P(X < x*) = P(k < ((1 - x*)^(-1/N) - 1) / tau_i)`, () => {
      const target = 0.88;
      const tauI = Math.round(((1 - target) ** (-1 / N) - 1) / 1.1e-3); // s each, k* a little above the centre
      const Vi = tauI * v0; // m3 each
      const r = rateUnderUncertainty({
        spec: {
          feed: { flowA: `${FA0 * 3600} mol/h`, concA: `${CA0 / 1000} mol/L` },
          reaction: { rate: { law: "power", k: "1e-3", orders: { A: 1 } } },
          stages: Array.from({ length: N }, () => ({ type: "CSTR" as const, volume: `${Vi * 1000} L` })),
        },
        uncertain: [{ field: "reaction.rate.k", kind: "plusMinus", fraction: 0.4 }], // 1e-3 ± 40 % = [a, b]
        target,
        samples: n,
        seed: 7 + N,
      });
      check(r, ((1 - target) ** (-1 / N) - 1) / tauI);
    });
  }

  it("the same seed gives the same result; another seed another", () => {
    const req = {
      spec: { feed: { flowA: FA0, concA: CA0 }, reaction: { rate: { law: "power" as const, k: 1e-3, orders: { A: 1 } } }, stages: [{ type: "PFR" as const, volume: 0.046 }] },
      uncertain: [{ field: "reaction.rate.k", kind: "normal" as const, mean: 1e-3, sd: 1e-4 }],
      target: 0.9,
      samples: 300,
    };
    expect(rateUnderUncertainty({ ...req, seed: 5 })).toEqual(rateUnderUncertainty({ ...req, seed: 5 }));
    expect(rateUnderUncertainty({ ...req, seed: 6 }).p50).not.toBe(rateUnderUncertainty({ ...req, seed: 5 }).p50);
  });
});
