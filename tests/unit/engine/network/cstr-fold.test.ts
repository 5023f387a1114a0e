import { describe, expect, it } from "vitest";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { lowBranchFold } from "../../../../lib/engine/network/cstr-fold";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import { firstOrder, liquid, rel } from "./helpers";

describe("where a stirred tank's low branch ends", () => {
  for (const beta of [0.01, 0.05, 0.1]) {
    it(`cubic autocatalysis, beta = ${beta}: the fold volume and conversion`, () => {
      const net = resolveNetwork(
        liquid({ A: 1000, B: 1000 * beta }, [{ stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 1e-8, orders: { A: 1, B: 2 } } }]),
      );
      // On the balance Da = g(x) = x/((1-x)(beta+x)^2) the low branch ends where g has its local maximum:
      // d ln g/dx = 1/x + 1/(1-x) - 2/(beta+x) = 0, i.e. 2x^2 - x + beta = 0, x = (1 - sqrt(1 - 8 beta))/4
      // (algebra). Da = k tau C_A0^2 = 1e-8 * 1e6 * V/v0.
      const xFold = (1 - Math.sqrt(1 - 8 * beta)) / 4;
      const daFold = xFold / ((1 - xFold) * (beta + xFold) ** 2);
      const vFold = (daFold / 0.01) * net.v0;
      const fold = lowBranchFold(net, net.F0, net.T0, 10 * vFold);
      expect(fold).not.toBeNull();
      const f = fold as NonNullable<typeof fold>;
      expect(f.volume).toBeLessThanOrEqual(vFold * (1 + 1e-9));
      expect(rel(f.volume, vFold)).toBeLessThan(1e-6);
      // near a fold x moves like the square root of the distance in V: 1e-6 in V is ~1e-3 in x
      expect(Math.abs(f.conversion - xFold)).toBeLessThan(5e-3);
      // the state there is the lowest of the tank's states at that volume
      const states = cstrSteadyStates(net, net.F0, net.T0, f.volume);
      expect(rel(states[0].conversion, f.conversion)).toBeLessThan(1e-6);
    });
  }

  it("a network without multiplicity has no fold up to the largest volume", () => {
    const net = resolveNetwork(liquid({ A: 500, B: 0, C: 0 }, [firstOrder("A", "B", 0.3), firstOrder("B", "C", 0.05)]));
    expect(lowBranchFold(net, net.F0, net.T0, 50)).toBeNull();
  });
});
