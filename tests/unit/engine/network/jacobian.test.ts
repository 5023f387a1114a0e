import { describe, expect, it } from "vitest";
import { makeKinetics } from "../../../../lib/engine/network/kinetics";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import type { NetworkSpec } from "../../../../lib/engine/network/types";

/**
 * The analytic dR/dF of power laws against central differences of R computed here (Richardson-extrapolated
 * central differences, a standard numerical check): liquid and gas, fractional orders, reverse terms.
 */
function spec(phase: "liquid" | "gas"): NetworkSpec {
  return {
    feed: { volumetricFlow: 2e-3, concentrations: { A: 40, B: 25, C: 3, D: 0.5, N: 12 }, temperature: 450 },
    phase,
    reactions: [
      { stoichiometry: { A: -1, B: -1, C: 1 }, rate: { law: "power", k: 3e-3, orders: { A: 1, B: 0.5 }, reverse: { k: 0.02, orders: { C: 1 } } } },
      { stoichiometry: { C: -2, D: 1 }, rate: { law: "power", k: 1e-3, orders: { C: 2 }, activationEnergy: 40000, referenceTemperature: 420 } },
      { stoichiometry: { A: -1, D: 2 }, rate: { law: "power", k: 0.2, orders: { A: 0.7, D: 1.3 } } },
    ],
    keyReactant: "A",
  };
}

describe("Jacobian of the production rates", () => {
  for (const phase of ["liquid", "gas"] as const) {
    it(`${phase}: analytic equals differences`, () => {
      const net = resolveNetwork(spec(phase));
      const kin = makeKinetics(net);
      const n = net.nSpecies;
      const F = Float64Array.from([0.06, 0.04, 0.01, 0.002, 0.024]);
      const T = 470;
      const J = new Float64Array(n * n);
      kin.jacobian(F, T, J);
      const R1 = new Float64Array(n);
      const R2 = new Float64Array(n);
      const diff = (k: number, h: number) => {
        const up = Float64Array.from(F);
        const down = Float64Array.from(F);
        up[k] += h;
        down[k] -= h;
        kin.production(up, T, R1);
        kin.production(down, T, R2);
        return Array.from(R1, (v, i) => (v - R2[i]) / (2 * h));
      };
      let largest = 0;
      for (const v of J) largest = Math.max(largest, Math.abs(v));
      for (let k = 0; k < n; k++) {
        const h = 1e-3 * F[k];
        const d1 = diff(k, h);
        const d2 = diff(k, h / 2);
        for (let i = 0; i < n; i++) {
          const richardson = (4 * d2[i] - d1[i]) / 3;
          expect(Math.abs(J[i * n + k] - richardson)).toBeLessThan(1e-7 * largest);
        }
      }
    });
  }
});
