import { describe, expect, it } from "vitest";
import { designNetwork, GAS_CONSTANT, type NetworkDesignSpec } from "@/lib/engine";
import { rateNetworkUnderUncertainty, type NetworkTrain } from "@/lib/robustness/network-monte-carlo";
import { networkProbabilitiesMeet } from "@/lib/robustness/network-sweep-ranking";
import { checkNetworkUncertainFields, networkTrainOf } from "@/lib/robustness/network-train";
import { checkUncertainFields } from "@/lib/robustness/train";
import type { AppError } from "@/lib/errors";

// A -> B -> C, both first order, in one stirred tank of residence time t (liquid). The tank balances give the
// closed form (Levenspiel, Chemical Reaction Engineering, 3rd ed., ch. 8):
//   C_B/C_A0 = k1 t / ((1 + k1 t)(1 + k2 t)),   X_A = k1 t / (1 + k1 t).
// Both rise with k1, so with k1 uniform on [a, b] and k2 fixed, P(Y < y*) = P(k1 < k1*) = (k1* - a)/(b - a),
// k1* solving k1* t / (1 + k1* t) = y* (1 + k2 t): k1* = u / (t (1 - u)), u = y* (1 + k2 t). Exact, from the
// uniform CDF; the sampled share must fall within 4 standard errors of it.
const v0 = 1e-3; // m3/s
const V = 1; // m3
const t = V / v0; // 1000 s
const k2 = 2e-4; // 1/s, k2 t = 0.2
const [a, b] = [5e-4, 3e-3]; // 1/s, k1 t from 0.5 to 3
const n = 2000;
// Each sample solves the tank's balances in full (every steady state): a safety bound for a loaded machine, not a timing.
const SLOW = { timeout: 120_000 };

const yieldOf = (k1: number) => (k1 * t) / ((1 + k1 * t) * (1 + k2 * t));
const k1ForYield = (y: number) => {
  const u = y * (1 + k2 * t);
  return u / (t * (1 - u));
};

function train(minYield: number | null, minConversion: number | null, k1: number | string = 1e-3): NetworkTrain {
  return {
    kind: "network",
    chemistry: {
      feed: { volumetricFlow: v0, concentrations: { A: 1000, B: 0, C: 0 }, temperature: 330 },
      phase: "liquid",
      reactions: [
        { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: k1, orders: { A: 1 }, activationEnergy: 50_000 } },
        { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: k2, orders: { B: 1 } } },
      ],
      keyReactant: "A",
    },
    stages: [{ type: "CSTR", volume: V }],
    product: "B",
    minConversion,
    minYield,
  };
}

const within4se = (sampled: number, exact: number) => {
  const se = Math.sqrt((exact * (1 - exact)) / n);
  expect(exact).toBeGreaterThan(0.1);
  expect(exact).toBeLessThan(0.9);
  expect(Math.abs(sampled - exact)).toBeLessThan(4 * se);
};

describe("Monte Carlo of a train of several reactions against the closed form of A -> B -> C in one tank", () => {
  it("k1 uniform: the chance of missing the minimum yield is (k1* - a)/(b - a)", SLOW, () => {
    const yStar = 0.5;
    const r = rateNetworkUnderUncertainty({ train: train(yStar, null), uncertain: [{ field: "reactions.0.rate.k", kind: "uniform", low: a, high: b }], samples: n, seed: 2026 });
    within4se(r.probabilityMissMinYield!, (k1ForYield(yStar) - a) / (b - a));
    expect(r.refusedSamples).toBe(0);
    // The median yield is the closed form at the median k1 (the yield rises with k1).
    expect(Math.abs(r.yield!.p50 - yieldOf((a + b) / 2))).toBeLessThan(0.01);
    expect(r.yield!.histogram).toHaveLength(20);
    expect(r.yield!.histogram.reduce((s, h) => s + h.count, 0)).toBe(n);
    // The yield never leaves the closed form's range over [a, b].
    expect(r.yield!.histogram[0].from).toBeGreaterThanOrEqual(yieldOf(a) - 1e-6);
    expect(r.yield!.histogram[19].to).toBeLessThanOrEqual(yieldOf(b) + 1e-6);
  });

  it("k1 ± 70 % of a constant typed with its unit: meeting both limits needs k1 above the larger of the two thresholds", SLOW, () => {
    // 0.105 1/min = 1.75e-3 1/s; ±70 % spans [5.25e-4, 2.975e-3] 1/s.
    const [lo, hi] = [1.75e-3 * 0.3, 1.75e-3 * 1.7];
    const minConversion = 0.65; // X >= 0.65 needs k1 t >= 0.65/0.35
    const minYield = 0.5;
    const r = rateNetworkUnderUncertainty({ train: train(minYield, minConversion, "0.105 1/min"), uncertain: [{ field: "reactions.0.rate.k", kind: "plusMinus", fraction: 0.7 }], samples: n, seed: 11 });
    const kNeeded = Math.max(minConversion / (1 - minConversion) / t, k1ForYield(minYield));
    within4se(r.probabilityMeet, (hi - kNeeded) / (hi - lo));
    within4se(r.probabilityMissMinYield!, (k1ForYield(minYield) - lo) / (hi - lo));
  });

  it("feed temperature uniform with Arrhenius k1: the constants stay given at the nominal feed temperature", SLOW, () => {
    // k1(T) = k1(330 K) exp(-Ea/R (1/T - 1/330)) (Arrhenius, common practice); the yield rises with T, so
    // P(Y < y*) = P(T < T*) = (T* - 315)/(345 - 315) with k1(T*) = k1*.
    const yStar = 0.5;
    const Ea = 50_000;
    const tStar = 1 / (1 / 330 - (GAS_CONSTANT * Math.log(k1ForYield(yStar) / 1e-3)) / Ea);
    const r = rateNetworkUnderUncertainty({ train: train(yStar, null), uncertain: [{ field: "feed.temperature", kind: "uniform", low: 315, high: 345 }], samples: n, seed: 5 });
    within4se(r.probabilityMissMinYield!, (tStar - 315) / 30);
  });

  it("the same seed gives the same run; a rate constant drawn below zero cannot be rated and counts as a miss", SLOW, () => {
    const ask = { train: train(0.3, null), uncertain: [{ field: "reactions.0.rate.k", kind: "normal" as const, mean: 1e-3, sd: 1e-3 }], samples: 500, seed: 9 };
    const first = rateNetworkUnderUncertainty(ask);
    expect(rateNetworkUnderUncertainty(ask)).toEqual(first);
    expect(rateNetworkUnderUncertainty({ ...ask, seed: 10 }).yield!.mean).not.toBe(first.yield!.mean);
    // P(k1 < 0) = Φ(-1) ≈ 0.159 for a normal (common practice); those samples are refused and missed.
    expect(first.refusedSamples).toBeGreaterThan(0.159 * 500 - 4 * Math.sqrt(0.159 * 0.841 * 500));
    expect(first.refusedSamples).toBeLessThan(0.159 * 500 + 4 * Math.sqrt(0.159 * 0.841 * 500));
    expect(first.probabilityMissMinYield! * 500).toBeGreaterThanOrEqual(first.refusedSamples);
    expect(first.probabilityMeet).toBeCloseTo(1 - first.probabilityMissMinYield!, 12);
  });
});

describe("chance of meeting every limit for each train of a sweep of several reactions", () => {
  it("each feasible train's share equals its own run's, infeasible trains have none", SLOW, () => {
    const spec: NetworkDesignSpec = {
      feed: { volumetricFlow: v0, concentrations: { A: 1000, B: 0, C: 0 } },
      phase: "liquid",
      reactions: [
        { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 1.5e-3, orders: { A: 1 } } },
        { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: k2, orders: { B: 1 } } },
      ],
      keyReactant: "A",
      thermal: { mode: "isothermal" },
      train: { candidates: [["CSTR"], ["PFR"]] },
      objective: { maximise: "yield", product: "B" },
      // One tank cannot reach 65 % (its best is 1/(sqrt(k2/k1) + 1)^2 = 53.7 %, Levenspiel ch. 8); the tube can (73.4 %).
      constraints: { minYield: 0.65, maxTotalVolume: 2 },
    };
    const result = designNetwork(spec);
    const robustness = { uncertain: [{ field: "reactions.0.rate.k" as const, kind: "plusMinus" as const, fraction: 0.4 }], samples: 300, seed: 21 };
    const shares = networkProbabilitiesMeet(spec, result, robustness);
    const asRecord = spec as unknown as Record<string, unknown>;
    expect(shares).toHaveLength(result.candidates.length);
    expect(result.candidates.map((c) => [c.sequence.join("-"), c.feasible])).toEqual([
      ["PFR", true],
      ["CSTR", false],
    ]);
    result.candidates.forEach((c, i) => {
      if (!c.feasible) return expect(shares[i]).toBeNull();
      const own = rateNetworkUnderUncertainty({ train: networkTrainOf(asRecord, c.stages), ...robustness });
      expect(shares[i]).toBe(own.probabilityMeet);
      expect(shares[i]).toBeGreaterThan(0);
      expect(shares[i]).toBeLessThan(1);
    });
    expect(networkProbabilitiesMeet(spec, result, null)).toEqual(result.candidates.map(() => null));
  });
});

describe("inputs a train does not offer are refused in the form's words", () => {
  it("a one-reaction input on a train of several reactions, and a network input on a one-reaction train, name the field by its label", () => {
    const net = networkTrainOf({ feed: { volumetricFlow: v0, concentrations: { A: 1000, B: 0 } }, phase: "liquid", reactions: [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: "0.06 1/min", orders: { A: 1 } } }], keyReactant: "A" }, []);
    expect(net.chemistry.reactions).toEqual([{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 1e-3, orders: { A: 1 } } }]);
    const refusedNet = (() => {
      try {
        checkNetworkUncertainFields(net, [{ field: "reactions.3.rate.k", kind: "plusMinus", fraction: 0.2 }]);
      } catch (err) {
        return err as AppError;
      }
    })();
    expect(refusedNet?.fields).toEqual({ "uncertain.0.field": ["Reaction 4, rate constant k is not an input of this train that can be varied; choose one from the list"] });
    const single = { feed: { flowA: 0.02, concA: 1000 }, reaction: { rate: { law: "power" as const, k: 1e-3, orders: { A: 1 } } }, stages: [{ type: "CSTR" as const, volume: 1 }] };
    const refusedSingle = (() => {
      try {
        checkUncertainFields(single, [{ field: "reactions.0.rate.k", kind: "plusMinus", fraction: 0.2 }]);
      } catch (err) {
        return err as AppError;
      }
    })();
    expect(refusedSingle?.fields?.["uncertain.0.field"]?.[0]).toBe("Reaction 1, rate constant k is not an input of this train that can be varied; choose one from the list");
  });
});
