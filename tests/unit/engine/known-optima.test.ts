import { describe, expect, it } from "vitest";
import { designTrains, type DesignSpec } from "../../../lib/engine/index";
import { powerSpec, rel, repeat } from "./helpers";

describe("known optima", () => {
  it("autocatalytic A + R -> 2R: the best pair is a CSTR to the rate maximum, then a PFR", () => {
    const theta = 0.04;
    const spec: DesignSpec = {
      feed: { flowA: 0.01, concA: 500, ratios: { R: theta } },
      reaction: { stoichiometry: { A: -1, R: 1 }, rate: { law: "power", k: 2e-5, orders: { A: 1, R: 1 } } },
      target: { conversion: 0.95 },
      train: { multiset: { CSTR: 1, PFR: 1 } },
    };
    const r = designTrains(spec);
    const best = r.candidates[0];
    expect(best.sequence).toEqual(["CSTR", "PFR"]);
    // Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 6 (autocatalytic reactions): the CSTR should stop
    // at the rate maximum; (1-X)(theta+X) is largest at X = (1 - theta)/2 (elementary calculus).
    expect(Math.abs(best.stages[0].conversionOut - (1 - theta) / 2)).toBeLessThan(1e-7);
    expect(best.totalVolume as number).toBeLessThan(r.reference.singlePFR as number);
    expect(best.totalVolume as number).toBeLessThan(r.reference.singleCSTR as number);
  });

  it("reversible A <=> R: the equilibrium conversion is K/(1+K) and no stage passes it", () => {
    const k = 0.01;
    const kr = 0.002;
    const K = k / kr;
    const spec: DesignSpec = {
      feed: { flowA: 0.02, concA: 800, ratios: { R: 0 } },
      reaction: {
        stoichiometry: { A: -1, R: 1 },
        rate: { law: "power", k, orders: { A: 1 }, reverse: { k: kr, orders: { R: 1 } } },
      },
      target: { conversion: 0.8 },
      train: { maxStages: 3 },
    };
    const r = designTrains(spec);
    // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 3: X_eq = K/(1+K) for A <=> R, no R fed
    expect(rel(r.equilibriumConversion as number, K / (1 + K))).toBeLessThan(1e-10);
    for (const c of r.candidates) for (const s of c.stages) expect(s.conversionOut).toBeLessThanOrEqual(K / (1 + K));
    // closed form, Levenspiel, ch. 5: PFR k tau = X_eq ln(X_eq/(X_eq - X)) for reversible first order, no R fed
    const xe = K / (1 + K);
    const v0 = 0.02 / 800;
    expect(rel(r.reference.singlePFR as number, (v0 * xe * Math.log(xe / (xe - 0.8))) / k)).toBeLessThan(1e-8);
  });

  for (const n of [2, 3, 4, 6]) {
    it(`the optimum of ${n} CSTRs for first order has equal volumes`, () => {
      const k = 0.02;
      const x = 0.97;
      const r = designTrains(powerSpec({ k, order: 1, target: x, candidates: [repeat("CSTR", n)] }));
      const stages = r.candidates[0].stages;
      const mean = (r.candidates[0].totalVolume as number) / n;
      // Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 6: for first order, equal-size tanks are optimal,
      // and the total is N((1-X)^(-1/N) - 1)/k (closed form).
      for (const s of stages) expect(rel(s.volume, mean)).toBeLessThan(1e-7);
      expect(rel(r.candidates[0].totalVolume as number, (n * ((1 - x) ** (-1 / n) - 1)) / k)).toBeLessThan(1e-9);
    });
  }

  it("second order, CSTR then CSTR meets the slope (rectangle) condition", () => {
    const r = designTrains(powerSpec({ k: 0.5, order: 2, target: 0.9, candidates: [["CSTR", "CSTR"]] }));
    const x1 = r.candidates[0].stages[0].conversionOut;
    const x2 = 0.9;
    // Levenspiel, ch. 6, optimum two CSTRs: the slope of 1/(-rA) at X1 equals the rectangle diagonal slope,
    // d(1/r)/dX at X1 = (1/r(X2) - 1/r(X1))/(X1 - 0) ... written as (X1)(d/dX)(1/r)(X1) = 1/r(X2) - 1/r(X1)
    const inv = (x: number) => 1 / (0.5 * (1 - x) ** 2);
    const slope = (2 / 0.5) / (1 - x1) ** 3;
    expect(rel(x1 * slope, inv(x2) - inv(x1))).toBeLessThan(1e-7);
  });

  it("adiabatic exothermic reversible: interstage cooling lets several stages pass the single-stage limit", () => {
    const spec: DesignSpec = {
      feed: { flowA: 0.5, concA: 1200, temperature: 330, ratios: { R: 0 } },
      reaction: {
        stoichiometry: { A: -1, R: 1 },
        rate: {
          law: "power", k: 0.004, orders: { A: 1 }, activationEnergy: 60000,
          reverse: { k: 0.00004, orders: { R: 1 }, activationEnergy: 120000 },
        },
        thermal: { mode: "adiabatic", adiabaticRise: 100, interstageTemperature: 330 },
      },
      target: { conversion: 0.9 },
      train: { maxStages: 3 },
    };
    const r = designTrains(spec);
    const xeq = r.equilibriumConversion as number;
    expect(xeq).toBeLessThan(0.9);
    const single = r.candidates.filter((c) => c.sequence.length === 1);
    for (const c of single) {
      expect(c.feasible).toBe(false);
      expect(c.totalVolume).toBeNull();
      expect(c.reason).toMatch(/equilibrium/);
    }
    const lastFeasible = Math.max(...r.candidates.filter((c) => c.feasible).map((c) => c.rank));
    for (const c of single) expect(c.rank).toBeGreaterThan(lastFeasible);
    // Energy balance, common practice: within a stage T = T_in + rise (X - X_in).
    for (const s of r.candidates[0].stages) {
      expect(Math.abs(s.temperatureOut - (s.temperatureIn + 100 * (s.conversionOut - s.conversionIn)))).toBeLessThan(1e-9);
    }
  });
});
