import { describe, expect, it } from "vitest";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import { liquid, rel } from "./helpers";

/**
 * The Van de Vusse scheme with Kokossis and Floudas's kinetics: A -> B (k1 = 1 1/s), B -> C (k2 = 2 1/s),
 * 2A -> D at r3 = 10 C_A^2 (mol/L; A is consumed at 2 r3), C_A0 = 1 mol/L (Floudas et al., Handbook of
 * Test Problems in Local and Global Optimization, Kluwer 1999, ch. 8). One stirred tank solves in closed
 * form: C_A0 - C_A = tau (k1 C_A + 2 k3 C_A^2), C_B = k1 tau C_A / (1 + k2 tau) (algebra of the balances).
 */
const net = resolveNetwork(
  liquid({ A: "1 mol/L", B: 0, C: 0, D: 0 }, [
    { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: "1 1/s", orders: { A: 1 } } },
    { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: "2 1/s", orders: { B: 1 } } },
    { stoichiometry: { A: -2, D: 1 }, rate: { law: "power", k: "10 L/(mol*s)", orders: { A: 2 } } },
  ]),
);

describe("Van de Vusse kinetics in one stirred tank", () => {
  for (const tau of [0.05, 0.3, 1, 4]) {
    it(`tau = ${tau} s`, () => {
      const states = cstrSteadyStates(net, net.F0, net.T0, tau * net.v0);
      expect(states).toHaveLength(1);
      const c = Array.from(states[0].flows, (f) => f / net.v0 / 1000); // mol/L
      const k1 = 1;
      const k2 = 2;
      const k3 = 10;
      const a = (-(1 + k1 * tau) + Math.sqrt((1 + k1 * tau) ** 2 + 8 * k3 * tau)) / (4 * k3 * tau);
      expect(rel(c[0], a)).toBeLessThan(1e-10);
      expect(rel(c[1], (k1 * tau * a) / (1 + k2 * tau))).toBeLessThan(1e-10);
      // D formed is k3 tau C_A^2 (one D per 2 A), common practice
      expect(rel(c[3], k3 * tau * a * a)).toBeLessThan(1e-10);
    });
  }
});
