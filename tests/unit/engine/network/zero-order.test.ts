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

  it("an intermediate consumed at zero order runs out, then is consumed as fast as it forms", () => {
    // A -> B at k1 C_A, B -> C at a constant k0 while B lasts. With B > 0: C_A = C_A0 e^(-k1 tau),
    // C_B = C_A0 (1 - e^(-k1 tau)) - k0 tau, C_C = k0 tau (linear ODEs, common practice). B runs out at
    // tau1 where C_B = 0; from there on B stays at zero and all B formed goes on to C: C_C = C_A0 - C_A.
    const CA0 = 100;
    const k1 = 0.1;
    const k0 = 5;
    const net3 = resolveNetwork(
      liquid({ A: CA0, B: 0, C: 0 }, [
        { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: k1, orders: { A: 1 } } },
        { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: k0, orders: {} } },
      ]),
    );
    // tau1 by bisection on C_B(tau) = 0 between a point where B is positive and one where it is not
    const cB = (tau: number) => CA0 * (1 - Math.exp(-k1 * tau)) - k0 * tau;
    let lo = 1;
    let hi = 100;
    expect(cB(lo)).toBeGreaterThan(0);
    expect(cB(hi)).toBeLessThan(0);
    for (let q = 0; q < 200; q++) {
      const mid = (lo + hi) / 2;
      if (cB(mid) > 0) lo = mid;
      else hi = mid;
    }
    const tau1 = lo;
    const taus = [0.5 * tau1, 0.99 * tau1, 1.01 * tau1, 2 * tau1, 4 * tau1];
    const res = pfrOutlet(net3, net3.F0, net3.T0, taus[4] * net3.v0, { outputVolumes: taus.map((t) => t * net3.v0) });
    res.profile.forEach((p, q) => {
      const t = taus[q];
      const a = CA0 * Math.exp(-k1 * t);
      const [fa, fb, fc] = Array.from(p.flows, (f) => f / net3.v0);
      expect(Math.abs(fa - a)).toBeLessThan(1e-8 * CA0);
      if (t < tau1) {
        expect(Math.abs(fb - cB(t))).toBeLessThan(1e-8 * CA0);
        expect(Math.abs(fc - k0 * t)).toBeLessThan(1e-8 * CA0);
      } else {
        expect(fb).toBe(0);
        expect(Math.abs(fc - (CA0 - a))).toBeLessThan(1e-8 * CA0);
      }
    });
  });

  it("the same constant rate written as an expression stops the same way, in tube and tank", () => {
    const expr = resolveNetwork(
      liquid({ A: 300, B: 10 }, [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "expression", expression: "k0", parameters: { k0: "2 mol/(m^3*s)" } } }]),
    );
    const tube = pfrOutlet(expr, expr.F0, expr.T0, 3 * vStar, { outputVolumes: [0.5 * vStar, 2 * vStar] });
    expect(rel(tube.profile[0].flows[0], expr.F0[0] - k * 0.5 * vStar)).toBeLessThan(1e-10);
    expect(tube.profile[1].flows[0]).toBe(0);
    expect(tube.flows[0]).toBe(0);
    expect(rel(tube.flows[1], expr.F0[0] + expr.F0[1])).toBeLessThan(1e-10);
    const tank = cstrSteadyStates(expr, expr.F0, expr.T0, 2 * vStar);
    expect(tank).toHaveLength(1);
    expect(tank[0].flows[0]).toBe(0);
    expect(rel(tank[0].flows[1], expr.F0[0] + expr.F0[1])).toBeLessThan(1e-12);
  });
});
