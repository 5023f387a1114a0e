import { describe, expect, it } from "vitest";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { reactionRatesAt } from "../../../../lib/engine/network/kinetics";
import { streamMeasures } from "../../../../lib/engine/network/measures";
import { pfrOutletByResidenceTime } from "../../../../lib/engine/network/pfr";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import { liquid, rel } from "./helpers";

// A -> R at k1 C_A (first order) and A -> S at k2 C_A^2 (second order), liquid.
const CA0 = 2000;
const k1 = 0.05;
const k2 = 5e-5;
const net = resolveNetwork(
  liquid({ A: CA0, R: 0, S: 0 }, [
    { stoichiometry: { A: -1, R: 1 }, rate: { law: "power", k: k1, orders: { A: 1 } } },
    { stoichiometry: { A: -1, S: 1 }, rate: { law: "power", k: "0.05 L/(mol*s)", orders: { A: 2 } } },
  ]),
);

describe("parallel reactions of orders 1 and 2", () => {
  it("reads the second-order constant given in L/(mol s)", () => {
    // 0.05 L/(mol s) = 5e-5 m3/(mol s)
    const r = reactionRatesAt(net, [CA0, 0, 0], net.T0);
    expect(rel(r[0], k1 * CA0)).toBeLessThan(1e-12);
    expect(rel(r[1], k2 * CA0 * CA0)).toBeLessThan(1e-12);
  });

  for (const tau of [3, 30, 120]) {
    it(`plug flow, tau = ${tau} s`, () => {
      const out = pfrOutletByResidenceTime(net, net.F0, net.T0, tau).flows;
      const [a, r, s] = [out[0] / net.v0, out[1] / net.v0, out[2] / net.v0];
      // Derived in closed form from dC_A/dtau = -(k1 C_A + k2 C_A^2) (a Bernoulli equation):
      // tau = (1/k1) ln[C_A0 (k1 + k2 C_A) / (C_A (k1 + k2 C_A0))], i.e.
      // 1/C_A = (1/C_A0 + k2/k1) e^(k1 tau) - k2/k1
      const aExact = 1 / ((1 / CA0 + k2 / k1) * Math.exp(k1 * tau) - k2 / k1);
      expect(rel(a, aExact)).toBeLessThan(1e-8);
      const tauBack = (1 / k1) * Math.log((CA0 * (k1 + k2 * a)) / (a * (k1 + k2 * CA0)));
      expect(rel(tauBack, tau)).toBeLessThan(1e-7);
      // C_R by integrating the instantaneous selectivity k1/(k1 + k2 C_A) over C_A from C_A0 down to C_A:
      // C_R = (k1/k2) ln[(k1 + k2 C_A0)/(k1 + k2 C_A)], and C_S = C_A0 - C_A - C_R
      const rExact = (k1 / k2) * Math.log((k1 + k2 * CA0) / (k1 + k2 * aExact));
      expect(rel(r, rExact)).toBeLessThan(1e-8);
      expect(rel(s, CA0 - aExact - rExact)).toBeLessThan(1e-8);
    });

    it(`one stirred tank, tau = ${tau} s`, () => {
      const states = cstrSteadyStates(net, net.F0, net.T0, tau * net.v0);
      expect(states).toHaveLength(1);
      const out = states[0].flows;
      // algebraic, common practice: C_A0 - C_A = tau (k1 C_A + k2 C_A^2), so
      // C_A = (-(1 + k1 tau) + sqrt((1 + k1 tau)^2 + 4 k2 tau C_A0)) / (2 k2 tau); C_R = k1 tau C_A; C_S = k2 tau C_A^2
      const b = 1 + k1 * tau;
      const a = (-b + Math.sqrt(b * b + 4 * k2 * tau * CA0)) / (2 * k2 * tau);
      expect(rel(out[0] / net.v0, a)).toBeLessThan(1e-10);
      expect(rel(out[1] / net.v0, k1 * tau * a)).toBeLessThan(1e-10);
      expect(rel(out[2] / net.v0, k2 * tau * a * a)).toBeLessThan(1e-10);
      const m = streamMeasures(net, out, net.T0, "R");
      // selectivity of R in a stirred tank is the instantaneous one at the outlet, common practice
      expect(rel(m.selectivity as number, k1 / (k1 + k2 * a))).toBeLessThan(1e-10);
    });
  }
});
