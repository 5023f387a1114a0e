import { describe, expect, it } from "vitest";
import { EngineError } from "../../../../lib/engine/errors";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import type { NetworkSpec } from "../../../../lib/engine/network/types";
import contractExample from "../../../fixtures/specs/network-three-reactions.json";

/** The contract's three-reaction example (the command line's fixture), a fresh copy each time. */
function base(): NetworkSpec {
  const { feed, phase, reactions, keyReactant } = structuredClone(contractExample) as unknown as NetworkSpec;
  return { feed, phase, reactions, keyReactant };
}

function failure(change: (s: NetworkSpec) => void): EngineError {
  const spec = base();
  change(spec);
  try {
    resolveNetwork(spec);
  } catch (err) {
    if (err instanceof EngineError) return err;
    throw err;
  }
  throw new Error("expected the spec to be refused");
}

describe("resolving a network", () => {
  it("reads the issue's example: species order, nu matrix and feed flows in SI", () => {
    const net = resolveNetwork({ ...base(), feed: { ...base().feed, volumetricFlow: "100 L/s", concentrations: { A: "0.58 mol/L", B: 0, C: 0, D: 0 } } });
    expect(net.species).toEqual(["A", "B", "C", "D"]);
    expect(Array.from(net.nu)).toEqual([-1, 0, -2, 1, -1, 0, 0, 1, 0, 0, 0, 1]);
    expect(net.v0).toBeCloseTo(0.1, 15);
    expect(net.F0[0]).toBeCloseTo(58, 10);
    expect(net.T0).toBe(300);
    expect(net.key).toBe(0);
  });

  it("defaults the feed temperature to 298.15 K and takes degC", () => {
    const spec = base();
    delete spec.feed.temperature;
    expect(resolveNetwork(spec).T0).toBe(298.15);
    spec.feed.temperature = "80 degC";
    expect(resolveNetwork(spec).T0).toBeCloseTo(353.15, 10);
  });

  const cases: [string, (s: NetworkSpec) => void, string, string][] = [
    ["a species in a stoichiometry missing from the feed", (s) => (s.reactions[1].stoichiometry = { B: -1, E: 1 }), "reactions.1.stoichiometry.E", "invalid-spec"],
    ["a species in an order missing from the feed", (s) => ((s.reactions[0].rate as { orders: Record<string, number> }).orders = { Q: 1 }), "reactions.0.rate.orders.Q", "invalid-spec"],
    ["a key reactant with zero feed", (s) => (s.feed.concentrations.A = 0), "feed.concentrations.A", "invalid-spec"],
    ["a key reactant not in the feed", (s) => (s.keyReactant = "Z"), "keyReactant", "invalid-spec"],
    ["a key reactant no reaction consumes", (s) => {
      s.keyReactant = "D";
      s.feed.concentrations.D = 5;
    }, "keyReactant", "invalid-spec"],
    ["a negative rate constant", (s) => ((s.reactions[2].rate as { k: number }).k = -1), "reactions.2.rate.k", "invalid-spec"],
    ["a negative reverse constant", (s) => ((s.reactions[0].rate as { reverse?: unknown }).reverse = { k: -2, orders: { B: 1 } }), "reactions.0.rate.reverse.k", "invalid-spec"],
    ["a negative flow", (s) => (s.feed.volumetricFlow = -0.1), "feed.volumetricFlow", "invalid-spec"],
    ["a negative concentration", (s) => (s.feed.concentrations.C = -3), "feed.concentrations.C", "invalid-spec"],
    ["a negative order", (s) => ((s.reactions[1].rate as { orders: Record<string, number> }).orders = { B: -1 }), "reactions.1.rate.orders.B", "invalid-spec"],
    ["a bad unit", (s) => (s.feed.concentrations.B = "3 furlongs"), "feed.concentrations.B", "invalid-unit"],
    ["a rate constant in the wrong unit", (s) => ((s.reactions[2].rate as { k: string }).k = "0.5 1/s"), "reactions.2.rate.k", "invalid-unit"],
    ["an expression that does not parse", (s) => (s.reactions[1].rate = { law: "expression", expression: "k * C_B +" , parameters: { k: 1 } }), "reactions.1.rate.expression", "invalid-expression"],
    ["an expression naming a species not fed", (s) => (s.reactions[1].rate = { law: "expression", expression: "k * C_X", parameters: { k: 1 } }), "reactions.1.rate.expression", "invalid-expression"],
    ["an expression that assigns", (s) => (s.reactions[1].rate = { law: "expression", expression: "k = 3", parameters: { k: 1 } }), "reactions.1.rate.expression", "invalid-expression"],
    ["more than ten reactions", (s) => (s.reactions = Array.from({ length: 11 }, () => base().reactions[0])), "reactions", "invalid-spec"],
    ["stage temperatures the wrong way round", (s) => (s.thermal = { mode: "stageTemperature", min: 400, max: 350 }), "thermal.max", "invalid-spec"],
  ];
  for (const [name, change, path, code] of cases) {
    it(`refuses ${name}, at its field`, () => {
      const err = failure(change);
      expect(err.path).toBe(path);
      expect(err.code).toBe(code);
      expect(err.message.length).toBeGreaterThan(10);
    });
  }

  it("takes a rate constant with units and Arrhenius terms", () => {
    const spec = base();
    spec.reactions[2].rate = { law: "power", k: "0.5 L/(mol*s)", orders: { A: 2 }, activationEnergy: "50 kJ/mol", referenceTemperature: 320 };
    const net = resolveNetwork(spec);
    const C = new Float64Array([100, 0, 0, 0]);
    // k(T) = k exp(-Ea/R (1/T - 1/Tref)), R = 8.314462618 J/(mol K) (CODATA); 0.5 L/(mol s) = 5e-4 m3/(mol s)
    const expected = 5e-4 * Math.exp((-50000 / 8.314462618) * (1 / 300 - 1 / 320)) * 100 ** 2;
    expect(Math.abs(net.rates[2].rate(C, 300) - expected) / expected).toBeLessThan(1e-12);
  });

  it("a law never sees a negative concentration", () => {
    const spec = base();
    spec.reactions[1].rate = { law: "expression", expression: "k * sqrt(C_B)", parameters: { k: 2 } };
    const net = resolveNetwork(spec);
    expect(net.rates[1].rate(new Float64Array([1, -4, 0, 0]), 300)).toBe(0);
    expect(net.rates[0].rate(new Float64Array([-1, 0, 0, 0]), 300)).toBe(0);
  });
});
