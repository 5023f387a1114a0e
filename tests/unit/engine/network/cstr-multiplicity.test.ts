import { describe, expect, it } from "vitest";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { makeKinetics } from "../../../../lib/engine/network/kinetics";
import { resolveNetwork, type ResolvedNetwork } from "../../../../lib/engine/network/resolve";
import type { NetworkSteadyState } from "../../../../lib/engine/network/types";
import { liquid, rel } from "./helpers";

/** max_i |F_out - F_in - V R_i(C_out)| / F_T,in, recomputed here from the rates. */
function balanceError(net: ResolvedNetwork, V: number, s: NetworkSteadyState): number {
  const kin = makeKinetics(net);
  const R = new Float64Array(net.nSpecies);
  kin.production(s.flows, net.T0, R);
  let worst = 0;
  for (let i = 0; i < net.nSpecies; i++) worst = Math.max(worst, Math.abs(s.flows[i] - net.F0[i] - V * R[i]));
  return worst / net.FT0;
}

describe("stirred tanks with several steady states", () => {
  it("cubic autocatalysis A + 2B -> 3B with a little B fed: all three states", () => {
    // r = k C_A C_B^2, beta = C_B0/C_A0 = 0.05, Da = k tau C_A0^2 = 4
    const net = resolveNetwork(
      liquid({ A: 1000, B: 50 }, [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 4e-8, orders: { A: 1, B: 2 } } }]),
    );
    const V = 100 * net.v0;
    const states = cstrSteadyStates(net, net.F0, net.T0, V);
    // The balance x = Da (1 - x)(beta + x)^2 is the cubic 4x^3 - 3.6x^2 + 0.61x - 0.01 = 0, whose roots are
    // x = 0.2 and (2.8 -+ sqrt(7.04))/8 (algebra, checked by substitution: 4 * 0.8 * 0.25^2 = 0.2).
    const expected = [(2.8 - Math.sqrt(7.04)) / 8, 0.2, (2.8 + Math.sqrt(7.04)) / 8];
    expect(states).toHaveLength(3);
    states.forEach((s, i) => {
      expect(rel(s.conversion, expected[i])).toBeLessThan(1e-9);
      expect(balanceError(net, V, s)).toBeLessThan(1e-9);
      expect(s.residual).toBeLessThan(1e-9);
    });
  });

  it("substrate inhibition r = k C_A/(1 + K C_A)^2 written as an expression: all three states", () => {
    const net = resolveNetwork(
      liquid({ A: 20, P: 0 }, [
        { stoichiometry: { A: -1, P: 1 }, rate: { law: "expression", expression: "k * C_A / (1 + K * C_A)^2", parameters: { k: 1, K: "1 m^3/mol" } } },
      ]),
    );
    const V = 100 * net.v0;
    const states = cstrSteadyStates(net, net.F0, net.T0, V);
    // (C_A0 - C_A)(1 + C_A)^2 = k tau C_A with C_A0 = 20, k tau = 100 is C_A^3 - 18 C_A^2 + 61 C_A - 20 = 0:
    // C_A = 4 (substitution: 16 * 25 = 400 = 100 * 4) and 7 -+ sqrt(44) (algebra)
    const outlet = [7 + Math.sqrt(44), 4, 7 - Math.sqrt(44)];
    expect(states).toHaveLength(3);
    states.forEach((s, i) => {
      expect(rel(s.flows[0] / net.v0, outlet[i])).toBeLessThan(1e-9);
      expect(balanceError(net, V, s)).toBeLessThan(1e-9);
    });
  });

  it("below the fold of the autocatalytic curve only the low state remains", () => {
    const net = resolveNetwork(
      liquid({ A: 1000, B: 50 }, [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 4e-8, orders: { A: 1, B: 2 } } }]),
    );
    // beta = 0.05, Da = 2: 2(1-x)(0.05+x)^2 = x has one root in [0, 1] (checked on a grid below)
    const V = 50 * net.v0;
    const states = cstrSteadyStates(net, net.F0, net.T0, V);
    const f = (x: number) => 2 * (1 - x) * (0.05 + x) ** 2 - x;
    let signChanges = 0;
    for (let q = 0; q < 100000; q++) if (Math.sign(f(q / 100000)) !== Math.sign(f((q + 1) / 100000))) signChanges++;
    expect(signChanges).toBe(1);
    expect(states).toHaveLength(1);
    expect(Math.abs(f(states[0].conversion))).toBeLessThan(1e-12);
  });

  it("finds as many states as the balance has roots, across the region of multiplicity (cubic autocatalysis)", () => {
    // Roots of Da (1 - x)(beta + x)^2 = x counted independently by sign changes on a grid of 2e5 points.
    let threeStates = 0;
    for (const beta of [0.01, 0.05]) {
      const net = resolveNetwork(
        liquid({ A: 1000, B: 1000 * beta }, [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 1e-8, orders: { A: 1, B: 2 } } }]),
      );
      for (let e = 0.3; e <= 1.3; e += 0.025) {
        const da = 10 ** e;
        const f = (x: number) => da * (1 - x) * (beta + x) ** 2 - x;
        let roots = 0;
        for (let q = 0; q < 200000; q++) if (Math.sign(f(q / 200000)) !== Math.sign(f((q + 1) / 200000))) roots++;
        // Da = k tau C_A0^2 = 1e-8 * tau * 1e6
        const states = cstrSteadyStates(net, net.F0, net.T0, (da / 0.01) * net.v0);
        expect(states.length, `beta ${beta}, Da ${da}`).toBe(roots);
        if (roots === 3) threeStates++;
        for (const s of states) expect(Math.abs(f(s.conversion))).toBeLessThan(1e-9);
      }
    }
    // the sweep does cross the region of three states, not only its edges
    expect(threeStates).toBeGreaterThan(10);
  });

  it("finds as many states as the balance has roots, across the region of multiplicity (substrate inhibition)", () => {
    // Roots of (C_A0 - C)(1 + C)^2 = k tau C counted independently by sign changes on a grid of 2e5 points.
    let threeStates = 0;
    for (const c0 of [20, 50]) {
      const net = resolveNetwork(
        liquid({ A: c0, P: 0 }, [{ stoichiometry: { A: -1, P: 1 }, rate: { law: "expression", expression: "k * C_A / (1 + K * C_A)^2", parameters: { k: 1, K: 1 } } }]),
      );
      for (let e = 1.6; e <= 2.8; e += 0.03) {
        const tau = 10 ** e;
        const f = (c: number) => (c0 - c) * (1 + c) ** 2 - tau * c;
        let roots = 0;
        for (let q = 0; q < 200000; q++) if (Math.sign(f((q / 200000) * c0)) !== Math.sign(f(((q + 1) / 200000) * c0))) roots++;
        const states = cstrSteadyStates(net, net.F0, net.T0, tau * net.v0);
        expect(states.length, `C_A0 ${c0}, tau ${tau}`).toBe(roots);
        if (roots === 3) threeStates++;
      }
    }
    expect(threeStates).toBeGreaterThan(10);
  });
});
