import { describe, expect, it } from "vitest";
import { EngineError, GAS_CONSTANT, networkPaths, networkTrainProfiles, rateNetworkTrain, type NetworkSpec } from "../../../../../lib/engine";
import { rel } from "../helpers";

const k = 0.05;
/** A -> 2B, first order, isobaric ideal gas, pure A at 40 mol/m3. */
const gas: NetworkSpec = {
  feed: { volumetricFlow: 1e-3, concentrations: { A: 40, B: 0 }, temperature: 400 },
  phase: "gas",
  reactions: [{ stoichiometry: { A: -1, B: 2 }, rate: { law: "power", k, orders: { A: 1 } } }],
  keyReactant: "A",
};
const eps = 1; // expansion of pure A -> 2B: y_A0 (2 - 1), common practice

describe("paths of an expanding gas, A -> 2B", () => {
  const paths = networkPaths(gas, "B", { points: 25 });
  it("the tube follows k t = (1 + eps) ln(1/(1 - X)) - eps X, C_A = C_A0 (1 - X)/(1 + eps X)", () => {
    // plug flow with a change of moles, t = V/v0 measured at the feed, common practice
    for (const q of paths.tube.slice(1)) {
      const x = q.conversion;
      expect(rel((1 + eps) * Math.log(1 / (1 - x)) - eps * x, k * q.residenceTime)).toBeLessThan(1e-7);
      expect(rel(q.key, (40 * (1 - x)) / (1 + eps * x))).toBeLessThan(1e-12);
      // two B per A used
      expect(rel(q.selectivity!, 2)).toBeLessThan(1e-12);
    }
  });
  it("every tank follows k t = X (1 + eps X)/(1 - X)", () => {
    // stirred tank with a change of moles, common practice
    expect(paths.tanks).toHaveLength(25);
    for (const q of paths.tanks) expect(rel((q.conversion * (1 + eps * q.conversion)) / (1 - q.conversion), k * q.residenceTime)).toBeLessThan(1e-9);
  });
});

describe("stages at their own temperature", () => {
  const Ea = 60e3;
  /** A -> B first order, liquid, k = 0.01 1/s at the feed's 300 K. */
  const hot: NetworkSpec = {
    feed: { volumetricFlow: 1e-3, concentrations: { A: 500, B: 0 }, temperature: 300 },
    phase: "liquid",
    reactions: [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 0.01, orders: { A: 1 }, activationEnergy: Ea } }],
    keyReactant: "A",
  };
  // Arrhenius, common practice: k(T) = k(T_ref) exp(-Ea/R (1/T - 1/T_ref))
  const kAt = (T: number) => 0.01 * Math.exp((-Ea / GAS_CONSTANT) * (1 / T - 1 / 300));

  it("a tank at 330 K then a tube at 350 K: each stage's closed form at its own rate constant", () => {
    const stages = [{ type: "CSTR" as const, volume: 0.02, temperature: 330 }, { type: "PFR" as const, volume: 0.01, temperature: 350 }];
    const r = rateNetworkTrain(hot, stages, "B");
    const afterTank = 500 / (1 + kAt(330) * 20);
    const out = afterTank * Math.exp(-kAt(350) * 10);
    expect(rel(r.stages[0].outlet.A, afterTank)).toBeLessThan(1e-9);
    expect(rel(r.outlet.A, out)).toBeLessThan(1e-8);
    expect(rel(r.yield!, (500 - out) / 500)).toBeLessThan(1e-9);
    const p = networkTrainProfiles(hot, stages);
    expect(rel(p.stages[1].points[p.stages[1].points.length - 1].concentrations.A, out)).toBeLessThan(1e-8);
  });

  it("without a stage temperature the stage runs at the feed's", () => {
    const r = rateNetworkTrain(hot, [{ type: "PFR", volume: 0.01 }]);
    expect(rel(r.outlet.A, 500 * Math.exp(-0.01 * 10))).toBeLessThan(1e-8);
  });

  it("a stage temperature below absolute zero names that stage's temperature", () => {
    let err: unknown;
    try {
      networkTrainProfiles(hot, [{ type: "PFR", volume: 0.01, temperature: -5 }]);
    } catch (e) {
      err = e;
    }
    expect(err).toBeInstanceOf(EngineError);
    expect((err as EngineError).path).toBe("stages.0.temperature");
  });
});
