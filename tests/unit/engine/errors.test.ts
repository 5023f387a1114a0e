import { describe, expect, it } from "vitest";
import { designTrains, EngineError, type DesignSpec } from "../../../lib/engine/index";

const base: DesignSpec = {
  feed: { flowA: 0.02, concA: 800, temperature: 340, ratios: { B: 1.2, R: 0 } },
  reaction: {
    stoichiometry: { A: -1, B: -1, R: 1 },
    rate: { law: "power", k: 1e-5, orders: { A: 1, B: 1 } },
  },
  target: { conversion: 0.9 },
  train: { maxStages: 2 },
};

function errorOf(spec: DesignSpec): EngineError {
  try {
    designTrains(spec);
  } catch (err) {
    if (err instanceof EngineError) return err;
    throw err;
  }
  throw new Error("expected an EngineError");
}

const withRate = (rate: DesignSpec["reaction"]["rate"]): DesignSpec => ({ ...base, reaction: { ...base.reaction, rate } });

describe("errors name the field", () => {
  it("target at or beyond equilibrium gives the equilibrium conversion", () => {
    const e = errorOf({
      ...base,
      feed: { flowA: 0.02, concA: 800, ratios: { R: 0 } },
      reaction: { stoichiometry: { A: -1, R: 1 }, rate: { law: "power", k: 0.01, orders: { A: 1 }, reverse: { k: 0.0025, orders: { R: 1 } } } },
      target: { conversion: 0.85 },
    });
    expect(e.code).toBe("equilibrium");
    expect(e.path).toBe("target.conversion");
    // closed form, Levenspiel, ch. 3: X_eq = K/(1+K) = 4/5
    expect(e.message).toContain("0.8");
  });
  it("negative rate constant", () => {
    const e = errorOf(withRate({ law: "power", k: -1, orders: { A: 1 } }));
    expect([e.code, e.path]).toEqual(["invalid-spec", "reaction.rate.k"]);
  });
  it("conversion outside (0, 1)", () => {
    expect(errorOf({ ...base, target: { conversion: 1 } }).path).toBe("target.conversion");
    expect(errorOf({ ...base, target: { conversion: 0 } }).path).toBe("target.conversion");
    expect(errorOf({ ...base, target: { conversion: Number.NaN } }).path).toBe("target.conversion");
  });
  it("a target beyond the limiting co-reactant", () => {
    const e = errorOf({ ...base, feed: { ...base.feed, ratios: { B: 0.8 } } });
    expect(e.path).toBe("target.conversion");
    expect(e.message).toContain("0.8");
  });
  it("orders that make no sense", () => {
    expect(errorOf(withRate({ law: "power", k: 1, orders: { A: Number.POSITIVE_INFINITY } })).path).toBe("reaction.rate.orders.A");
    expect(errorOf(withRate({ law: "power", k: 1, orders: { A: 1, R: -1 } })).path).toBe("reaction.rate.orders.R");
    expect(errorOf(withRate({ law: "power", k: 1, orders: { Q: 1 } })).path).toBe("reaction.rate.orders.Q");
  });
  it("a rate that is zero before the target", () => {
    const e = errorOf(withRate({ law: "expression", expression: "1e-3 * (0.5 - X)" }));
    expect(e.path).toBe("reaction.rate.expression");
    expect(e.message).toContain("0.5");
  });
  it("an expression that does not parse, or uses an unknown variable", () => {
    expect(errorOf(withRate({ law: "expression", expression: "k * C_A *" , parameters: { k: 1 } })).code).toBe("invalid-expression");
    const e = errorOf(withRate({ law: "expression", expression: "k * C_Z", parameters: { k: 1 } }));
    expect([e.code, e.path]).toEqual(["invalid-expression", "reaction.rate.expression"]);
    expect(e.message).toContain("C_Z");
  });
  it("a target outside a rate table", () => {
    const e = errorOf(withRate({ law: "table", conversion: [0, 0.5, 0.8], rate: [1, 0.8, 0.5] }));
    expect(e.path).toBe("target.conversion");
    expect(e.message).toContain("0.8");
  });
  it("a temperature limit that no stage can keep", () => {
    const e = errorOf({ ...base, reaction: { ...base.reaction, thermal: { mode: "adiabatic", adiabaticRise: 80, maxTemperature: 380 } } });
    expect(e.path).toBe("reaction.thermal.maxTemperature");
  });
  it("unknown or mismatched units", () => {
    expect(errorOf({ ...base, feed: { ...base.feed, concA: "2 florps" } }).path).toBe("feed.concA");
    const e = errorOf({ ...base, feed: { ...base.feed, flowA: "3 kg/s" } });
    expect([e.code, e.path]).toEqual(["invalid-unit", "feed.flowA"]);
  });
  it("units convert: '0.8 M' and '340 K' equal the SI numbers", () => {
    const a = designTrains(base);
    const b = designTrains({ ...base, feed: { ...base.feed, concA: "0.8 M", temperature: "66.85 degC", flowA: "72 mol/h" } });
    // Unit definitions, common practice: 1 M = 1000 mol/m3, 0 degC = 273.15 K, 1 h = 3600 s
    expect(Math.abs((b.reference.singlePFR as number) / (a.reference.singlePFR as number) - 1)).toBeLessThan(1e-12);
  });
  it("no sequence can reach the target", () => {
    const e = errorOf({
      ...base,
      reaction: {
        ...base.reaction,
        rate: { law: "power", k: 1e-5, orders: { A: 1, B: 1 }, activationEnergy: 50000 },
        thermal: { mode: "adiabatic", adiabaticRise: 200, maxTemperature: 400, interstageTemperature: 340 },
      },
      train: { maxStages: 1 },
    });
    expect([e.code, e.path]).toEqual(["infeasible", "target.conversion"]);
  });
});
