import { describe, expect, it } from "vitest";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { pfrOutletByResidenceTime } from "../../../../lib/engine/network/pfr";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import { liquid, rel } from "./helpers";

const kf = 0.03;

function reversible(kr: number, ea = 0, eaReverse = 0) {
  return resolveNetwork(
    liquid({ A: 800, B: 0 }, [
      {
        stoichiometry: { A: -1, B: 1 },
        rate: { law: "power", k: kf, orders: { A: 1 }, activationEnergy: ea, reverse: { k: kr, orders: { B: 1 }, activationEnergy: eaReverse } },
      },
    ]),
  );
}

describe("reversible A <=> B, first order both ways", () => {
  for (const K of [0.5, 3, 40]) {
    const net = reversible(kf / K);
    const tauLong = 60 / (kf + kf / K);
    it(`reaches X = K/(1+K) for a long residence time, K = ${K}`, () => {
      // equilibrium conversion of A <=> B, common practice: X_e = K/(1+K)
      const xe = K / (1 + K);
      const pfr = 1 - pfrOutletByResidenceTime(net, net.F0, net.T0, tauLong).flows[0] / net.F0[0];
      expect(rel(pfr, xe)).toBeLessThan(1e-9);
      const cstr = cstrSteadyStates(net, net.F0, net.T0, 1e6 * tauLong * net.v0);
      expect(cstr).toHaveLength(1);
      expect(rel(cstr[0].conversion, xe)).toBeLessThan(1e-6);
    });

    it(`stirred tank: X = kf tau/(1 + (kf + kr) tau), K = ${K}`, () => {
      const tau = 20;
      const x = cstrSteadyStates(net, net.F0, net.T0, tau * net.v0)[0].conversion;
      // algebraic balance of a stirred tank, common practice
      expect(rel(x, (kf * tau) / (1 + (kf + kf / K) * tau))).toBeLessThan(1e-10);
    });
  }

  it("Arrhenius terms shift the equilibrium by exp(-(Ea - Ea_rev)/R (1/T - 1/T0))", () => {
    const net = reversible(0.01, 60000, 20000);
    const T = net.T0 + 40;
    // k(T) = k exp(-Ea/R (1/T - 1/Tref)), R = 8.314462618 J/(mol K) (CODATA); K(T) = kf(T)/kr(T)
    const K = 3 * Math.exp((-(60000 - 20000) / 8.314462618) * (1 / T - 1 / net.T0));
    const x = 1 - pfrOutletByResidenceTime(net, net.F0, T, 2000).flows[0] / net.F0[0];
    expect(rel(x, K / (1 + K))).toBeLessThan(1e-8);
  });
});
