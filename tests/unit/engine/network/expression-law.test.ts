import { describe, expect, it } from "vitest";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { pfrOutletByResidenceTime } from "../../../../lib/engine/network/pfr";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import { liquid, rel } from "./helpers";

/**
 * Rates written as expressions go through difference Jacobians in the tube and the tank; the closed
 * forms of the series reactions check that path too.
 */
describe("rates written as expressions", () => {
  const k1 = 0.4;
  const k2 = 0.1;
  const Ea = 30000;
  const net = resolveNetwork(
    liquid({ A: 250, B: 0, C: 0 }, [
      { stoichiometry: { A: -1, B: 1 }, rate: { law: "expression", expression: "k1 * exp(-Ea / 8.314462618 * (1/T - 1/300)) * C_A", parameters: { k1, Ea: "30 kJ/mol" } } },
      { stoichiometry: { B: -1, C: 1 }, rate: { law: "expression", expression: "k2 * C_B", parameters: { k2: "6 1/min" } } },
    ]),
  );

  it("the tube follows the series closed form at the feed temperature and at 320 K", () => {
    for (const T of [300, 320]) {
      // Arrhenius, R = 8.314462618 J/(mol K) (CODATA)
      const a1 = k1 * Math.exp((-Ea / 8.314462618) * (1 / T - 1 / 300));
      const tau = 7;
      const out = pfrOutletByResidenceTime(net, Float64Array.from([250, 0, 0].map((c) => c * net.v0)), T, tau).flows;
      // closed form for first-order series reactions, common practice
      const b = ((250 * a1) / (k2 - a1)) * (Math.exp(-a1 * tau) - Math.exp(-k2 * tau));
      expect(rel(out[0] / net.v0, 250 * Math.exp(-a1 * tau))).toBeLessThan(1e-8);
      expect(rel(out[1] / net.v0, b)).toBeLessThan(1e-8);
    }
  });

  it("the tank follows the series closed form", () => {
    const tau = 7;
    const s = cstrSteadyStates(net, net.F0, 300, tau * net.v0);
    expect(s).toHaveLength(1);
    // stirred tank, series first order, common practice: C_A = C_A0/(1 + k1 tau), C_B = k1 tau C_A/(1 + k2 tau)
    const a = 250 / (1 + k1 * tau);
    expect(rel(s[0].flows[0] / net.v0, a)).toBeLessThan(1e-10);
    expect(rel(s[0].flows[1] / net.v0, (k1 * tau * a) / (1 + k2 * tau))).toBeLessThan(1e-10);
  });
});
