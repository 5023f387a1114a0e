import { describe, expect, it } from "vitest";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { streamMeasures } from "../../../../lib/engine/network/measures";
import { pfrOutlet, pfrOutletByResidenceTime } from "../../../../lib/engine/network/pfr";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import { firstOrder, liquid, rel } from "./helpers";

const CA0 = 580;

/** A -> B -> C, both first order, liquid. */
function series(k1: number, k2: number) {
  return resolveNetwork(liquid({ A: CA0, B: 0, C: 0 }, [firstOrder("A", "B", k1), firstOrder("B", "C", k2)]));
}

const CASES = [
  { k1: 0.8, k2: 0.3 },
  { k1: 0.05, k2: 0.4 },
  { k1: 2e-3, k2: 2.1e-3 },
];

describe("series reactions A -> B -> C, first order", () => {
  for (const { k1, k2 } of CASES) {
    const net = series(k1, k2);
    const cB = (F: Float64Array) => F[1] / net.v0;

    it(`plug flow, k1=${k1}, k2=${k2}: the largest C_B and where it is`, () => {
      const tauOpt = Math.log(k2 / k1) / (k2 - k1);
      const at = (tau: number) => cB(pfrOutletByResidenceTime(net, net.F0, net.T0, tau).flows);
      // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 8: plug flow
      // C_B,max/C_A0 = (k1/k2)^(k2/(k2-k1)) at tau = ln(k2/k1)/(k2-k1)
      const best = (k1 / k2) ** (k2 / (k2 - k1));
      expect(rel(at(tauOpt) / CA0, best)).toBeLessThan(1e-8);
      expect(at(tauOpt * 0.99)).toBeLessThan(at(tauOpt));
      expect(at(tauOpt * 1.01)).toBeLessThan(at(tauOpt));
      // The tube stopped where B is largest finds the same point.
      const stopped = pfrOutlet(net, net.F0, net.T0, 10 * tauOpt * net.v0, { stopAtMaxOf: "B" });
      expect(stopped.status).toBe("stopped");
      expect(rel(stopped.volume / net.v0, tauOpt)).toBeLessThan(1e-5);
      expect(rel(cB(stopped.flows) / CA0, best)).toBeLessThan(1e-8);
    });

    it(`plug flow, k1=${k1}, k2=${k2}: the profile against residence time`, () => {
      const taus = [0, 0.1, 0.5, 1, 2, 5].map((f) => f / Math.min(k1, k2));
      const res = pfrOutlet(net, net.F0, net.T0, taus[taus.length - 1] * net.v0, { outputVolumes: taus.map((t) => t * net.v0) });
      expect(res.profile.map((p) => p.residenceTime)).toEqual(taus.map((t) => (t * net.v0) / net.v0));
      for (const p of res.profile) {
        const t = p.residenceTime;
        // closed form for first-order series reactions, common practice:
        // C_A = C_A0 e^(-k1 t), C_B = C_A0 k1/(k2-k1) (e^(-k1 t) - e^(-k2 t))
        const a = CA0 * Math.exp(-k1 * t);
        const b = ((CA0 * k1) / (k2 - k1)) * (Math.exp(-k1 * t) - Math.exp(-k2 * t));
        expect(Math.abs(p.flows[0] / net.v0 - a)).toBeLessThan(1e-7 * CA0);
        expect(Math.abs(p.flows[1] / net.v0 - b)).toBeLessThan(1e-7 * CA0);
      }
    });

    it(`one stirred tank, k1=${k1}, k2=${k2}: the largest C_B and where it is`, () => {
      const tauOpt = 1 / Math.sqrt(k1 * k2);
      const at = (tau: number) => {
        const states = cstrSteadyStates(net, net.F0, net.T0, tau * net.v0);
        expect(states).toHaveLength(1);
        return cB(states[0].flows);
      };
      // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 8: one stirred tank
      // C_B,max/C_A0 = 1/((k2/k1)^(1/2) + 1)^2 at tau = 1/sqrt(k1 k2)
      const best = 1 / (Math.sqrt(k2 / k1) + 1) ** 2;
      expect(rel(at(tauOpt) / CA0, best)).toBeLessThan(1e-10);
      expect(at(tauOpt * 0.99)).toBeLessThan(at(tauOpt));
      expect(at(tauOpt * 1.01)).toBeLessThan(at(tauOpt));
    });
  }

  it("yield and selectivity of B at the plug-flow optimum", () => {
    const k1 = 0.8;
    const k2 = 0.3;
    const net = series(k1, k2);
    const tauOpt = Math.log(k2 / k1) / (k2 - k1);
    const out = pfrOutletByResidenceTime(net, net.F0, net.T0, tauOpt);
    const m = streamMeasures(net, out.flows, net.T0, "B");
    // closed forms as above, Levenspiel ch. 8: X = 1 - e^(-k1 tau), Y = C_B,max/C_A0, S = Y/X
    const x = 1 - Math.exp(-k1 * tauOpt);
    const y = (k1 / k2) ** (k2 / (k2 - k1));
    expect(rel(m.conversion, x)).toBeLessThan(1e-8);
    expect(rel(m.yield as number, y)).toBeLessThan(1e-8);
    expect(rel(m.selectivity as number, y / x)).toBeLessThan(1e-8);
    expect(rel(m.outlet.B, y * CA0)).toBeLessThan(1e-8);
  });
});
