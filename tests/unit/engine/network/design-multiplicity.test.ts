import { describe, expect, it } from "vitest";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { tanksHaveOneState } from "../../../../lib/engine/network/cstr-uniqueness";
import { designNetwork, makeProblem } from "../../../../lib/engine/network/design";
import type { NetworkDesignSpec } from "../../../../lib/engine/network/design-types";
import { makeKinetics } from "../../../../lib/engine/network/kinetics";
import { optimiseSequence, type SequenceDesign } from "../../../../lib/engine/network/optimise";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import { evaluateTrain } from "../../../../lib/engine/network/train-eval";
import { firstOrder, liquid, rel } from "./helpers";

/**
 * Cubic autocatalysis A + 2B -> 3B (r1 = k1 C_A C_B^2) beside a plain route A -> C (r2 = k2 C_A), a little
 * B fed (beta = C_B0/C_A0 = 0.01): a tank has three steady states over a range of sizes, and the yield of C
 * is best on the low branch. Dimensionless: a = C_A/C_A0, b = C_B/C_A0, D = k1 tau C_A0^2, rho = k2/(k1 C_A0^2).
 * Balances (algebra): b - beta = D a b^2 and 1 - a = D a b^2 + rho D a, so along the curve of states
 * D(b) = (b - beta)/(b^2 - (b - beta)(rho + b^2)), a = 1/(1 + rho D + D b^2), yield of C = rho D a.
 */
const beta = 0.01;
const rho = 0.02;
const A0 = 1000;
const k1 = 1e-8;
const v0 = 1;
const autocatalytic: NetworkDesignSpec = {
  feed: { volumetricFlow: v0, concentrations: { A: A0, B: beta * A0, C: 0 } },
  phase: "liquid",
  keyReactant: "A",
  reactions: [
    { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: k1, orders: { A: 1, B: 2 } } },
    { stoichiometry: { A: -1, C: 1 }, rate: { law: "power", k: rho * k1 * A0 * A0, orders: { A: 1 } } },
  ],
  train: { candidates: [["CSTR"], ["CSTR", "CSTR"]] },
  objective: { maximise: "yield", product: "C" },
  constraints: { maxTotalVolume: 2e4 },
};
const D = (b: number) => (b - beta) / (b * b - (b - beta) * (rho + b * b));
const yieldC = (b: number) => {
  const d = D(b);
  return (rho * d) / (1 + rho * d + d * b * b);
};
/** The low branch runs from b = beta up to the fold, the first maximum of D(b) (bisection on its slope). */
function lowBranchEnd(): number {
  let lo = beta + 1e-12;
  let hi = 0.6; // D(b) falls again before b = 0.6 (looked at on a grid of D(b))
  for (let k = 0; k < 200; k++) {
    const mid = 0.5 * (lo + hi);
    if (D(mid * (1 + 1e-9)) > D(mid)) lo = mid;
    else hi = mid;
  }
  return lo;
}

describe("which networks give every stirred tank one steady state (Soulé's graphic condition)", () => {
  it("series, parallel and Van de Vusse networks of power laws pass", () => {
    // no feedback: each species acts only on what its reactions form or consume downstream (common practice: such tanks have one state)
    expect(tanksHaveOneState(resolveNetwork(liquid({ A: 500, B: 0, C: 0 }, [firstOrder("A", "B", 0.3), firstOrder("B", "C", 0.05)])))).toBe(true);
    const vdv = liquid({ A: 1000, B: 0, C: 0, D: 0 }, [
      firstOrder("A", "B", 1),
      firstOrder("B", "C", 2),
      { stoichiometry: { A: -2, D: 1 }, rate: { law: "power", k: 0.01, orders: { A: 2 } } },
    ]);
    expect(tanksHaveOneState(resolveNetwork(vdv))).toBe(true);
  });

  it("autocatalysis, directly or through an intermediate, an expression law and a gas do not", () => {
    expect(tanksHaveOneState(resolveNetwork(autocatalytic))).toBe(false);
    // A + X -> Y, Y -> 2X: X raises Y and Y raises X, a positive circuit of two
    const cycle = liquid({ A: 100, X: 1, Y: 0 }, [
      { stoichiometry: { A: -1, X: -1, Y: 1 }, rate: { law: "power", k: 1e-3, orders: { A: 1, X: 1 } } },
      { stoichiometry: { Y: -1, X: 2 }, rate: { law: "power", k: 1, orders: { Y: 1 } } },
    ]);
    expect(tanksHaveOneState(resolveNetwork(cycle))).toBe(false);
    const expression = liquid({ A: 20, P: 0 }, [{ stoichiometry: { A: -1, P: 1 }, rate: { law: "expression", expression: "k * C_A", parameters: { k: 1 } } }]);
    expect(tanksHaveOneState(resolveNetwork(expression))).toBe(false);
    const gas = { ...liquid({ A: 40, B: 0 }, [firstOrder("A", "B", 1)]), phase: "gas" as const };
    expect(tanksHaveOneState(resolveNetwork(gas))).toBe(false);
  });
});

describe("the search scores the state the report continues from (the lowest conversion)", { timeout: 120000 }, () => {
  it("a tank where Newton from the feed lands on the middle state is scored at the low one", () => {
    const net = resolveNetwork(autocatalytic);
    const V = 4427.79; // m3: inside the region of three states, found by looking at the states on a grid of sizes
    const fromFeed = cstrSteadyStates(net, net.F0, net.T0, V, { starts: 0 })[0];
    const all = cstrSteadyStates(net, net.F0, net.T0, V);
    expect(all).toHaveLength(3);
    // the trap: Newton from the feed does not reach the lowest state here
    expect(fromFeed.conversion - all[0].conversion).toBeGreaterThan(1e-3);
    const problem = makeProblem(autocatalytic, makeKinetics(net));
    expect(problem.tanksUnique).toBe(false);
    const score = evaluateTrain(problem, ["CSTR"], [V / v0]);
    // the low state from the closed form: the smallest b with D(b) = D at this size (bisection below the fold)
    const target = (k1 * A0 * A0 * V) / v0;
    let lo = beta;
    let hi = lowBranchEnd();
    for (let k = 0; k < 200; k++) {
      const mid = 0.5 * (lo + hi);
      if (D(mid) < target) lo = mid;
      else hi = mid;
    }
    expect(rel(score.value, yieldC(lo))).toBeLessThan(1e-9);
  });

  it("ranking = report: each sequence's search score is its reported objective, and one tank's is the closed-form best of the low branch", () => {
    const result = designNetwork(autocatalytic);
    const problem = makeProblem(autocatalytic, makeKinetics(resolveNetwork(autocatalytic)));
    const memo = new Map<string, SequenceDesign>();
    for (const c of result.candidates) {
      expect(c.feasible).toBe(true);
      const searched = optimiseSequence(problem, c.sequence, memo);
      expect(rel(searched.score.value, c.objective!)).toBeLessThan(1e-12);
    }
    // best yield of C on the low branch: golden-section search of yieldC over b in [beta, fold] (one maximum there, seen on a grid)
    let a = beta;
    let b = lowBranchEnd();
    const g = (Math.sqrt(5) - 1) / 2;
    for (let k = 0; k < 200; k++) {
      const x1 = b - g * (b - a);
      const x2 = a + g * (b - a);
      if (yieldC(x1) < yieldC(x2)) a = x1;
      else b = x2;
    }
    const one = result.candidates.find((c) => c.sequence.length === 1)!;
    expect(rel(one.objective!, yieldC(a))).toBeLessThan(1e-6);
    // two tanks do at least as well as one (the optimum is never below a contiguous part's, common practice)
    const two = result.candidates.find((c) => c.sequence.length === 2)!;
    expect(two.objective!).toBeGreaterThanOrEqual(one.objective! * (1 - 1e-9));
  });
});
