import { describe, expect, it } from "vitest";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { pfrOutlet } from "../../../../lib/engine/network/pfr";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import { liquid, rel } from "./helpers";

// A -> B at a constant k = 2 mol/(m3 s) while A lasts; C_A0 = 300 mol/m3, v0 = 1e-3 m3/s, so A runs out
// at V* = F_A0 / k = 0.3 / 2 = 0.15 m3 (zero order: F_A = F_A0 - k V, common practice).
const k = 2;
const net = resolveNetwork(liquid({ A: 300, B: 10 }, [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k, orders: {} } }]));
const vStar = net.F0[0] / k;

describe("a zero-order reaction whose reactant runs out", () => {
  it("in a tube: falls linearly, reaches zero at V*, then stays at exactly zero", () => {
    const V = 3 * vStar;
    const res = pfrOutlet(net, net.F0, net.T0, V, { outputVolumes: [0.5 * vStar, 0.9 * vStar, 1.2 * vStar, 2 * vStar, V] });
    expect(rel(res.profile[0].flows[0], net.F0[0] - k * 0.5 * vStar)).toBeLessThan(1e-10);
    expect(rel(res.profile[1].flows[0], net.F0[0] - k * 0.9 * vStar)).toBeLessThan(1e-10);
    for (const p of res.profile.slice(2)) {
      expect(p.flows[0]).toBe(0);
      expect(rel(p.flows[1], net.F0[1] + net.F0[0])).toBeLessThan(1e-10);
    }
    expect(res.flows[0]).toBe(0);
    expect(res.status).toBe("ok");
  });

  it("in a stirred tank: F_A = F_A0 - k V while the supply lasts, exactly zero beyond", () => {
    const small = cstrSteadyStates(net, net.F0, net.T0, 0.6 * vStar);
    expect(small).toHaveLength(1);
    expect(rel(small[0].flows[0], net.F0[0] - k * 0.6 * vStar)).toBeLessThan(1e-12);
    for (const f of [1.0001, 1.5, 40]) {
      const big = cstrSteadyStates(net, net.F0, net.T0, f * vStar);
      expect(big).toHaveLength(1);
      expect(big[0].flows[0]).toBe(0);
      expect(big[0].conversion).toBe(1);
      expect(rel(big[0].flows[1], net.F0[1] + net.F0[0])).toBeLessThan(1e-12);
    }
  });

  it("a zero-order side reaction stops when A runs out while the first-order one had its share", () => {
    // A -> B (first order, k1) and A -> C (zero order, k0). Until A runs out, dF_A/dV = -(k1 C_A + k0)
    // gives C_A(tau) = (C_A0 + k0/k1) e^(-k1 tau) - k0/k1 (linear ODE, common practice), zero at
    // tau* = ln(1 + k1 C_A0/k0)/k1; the C formed by then is k0 tau*.
    const k1 = 0.01;
    const k0 = 1.5;
    const two = resolveNetwork(
      liquid({ A: 300, B: 0, C: 0 }, [
        { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: k1, orders: { A: 1 } } },
        { stoichiometry: { A: -1, C: 1 }, rate: { law: "power", k: k0, orders: { A: 0 } } },
      ]),
    );
    const tauStar = Math.log(1 + (k1 * 300) / k0) / k1;
    const out = pfrOutlet(two, two.F0, two.T0, 2 * tauStar * two.v0).flows;
    expect(out[0]).toBe(0);
    expect(rel(out[2] / two.v0, k0 * tauStar)).toBeLessThan(1e-8);
    expect(rel(out[1] / two.v0, 300 - k0 * tauStar)).toBeLessThan(1e-8);
  });
});
