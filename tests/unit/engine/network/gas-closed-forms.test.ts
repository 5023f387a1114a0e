import { describe, expect, it } from "vitest";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { streamMeasures } from "../../../../lib/engine/network/measures";
import { pfrOutletByResidenceTime } from "../../../../lib/engine/network/pfr";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import type { NetworkSpec } from "../../../../lib/engine/network/types";
import { rel } from "./helpers";

const k = 0.2;

/** A -> 2B, first order, isobaric ideal gas; `inert` mol/m3 of I alongside 40 mol/m3 of A. */
function gas(inert: number): NetworkSpec {
  return {
    feed: { volumetricFlow: "6 m^3/min", concentrations: { A: 40, B: 0, I: inert }, temperature: 500 },
    phase: "gas",
    reactions: [{ stoichiometry: { A: -1, B: 2 }, rate: { law: "power", k, orders: { A: 1 } } }],
    keyReactant: "A",
  };
}

describe("isobaric gas, A -> 2B first order", () => {
  for (const inert of [0, 40, 120]) {
    const net = resolveNetwork(gas(inert));
    const eps = 40 / (40 + inert); // y_A0 (2 - 1): Levenspiel ch. 3, common practice

    for (const tau of [0.5, 4, 25]) {
      it(`plug flow, inerts ${inert} mol/m3, tau = ${tau} s`, () => {
        const out = pfrOutletByResidenceTime(net, net.F0, net.T0, tau).flows;
        const m = streamMeasures(net, out, net.T0);
        const x = m.conversion;
        // closed form, Levenspiel, Chemical Reaction Engineering 3rd ed., ch. 5 (common practice):
        // k tau = (1 + eps) ln(1/(1 - X)) - eps X
        expect(rel((1 + eps) * Math.log(1 / (1 - x)) - eps * x, k * tau)).toBeLessThan(1e-8);
        // outlet concentration of A, Levenspiel ch. 3: C_A = C_A0 (1 - X)/(1 + eps X)
        expect(rel(m.outlet.A, (40 * (1 - x)) / (1 + eps * x))).toBeLessThan(1e-12);
      });

      it(`one stirred tank, inerts ${inert} mol/m3, tau = ${tau} s`, () => {
        const states = cstrSteadyStates(net, net.F0, net.T0, tau * net.v0);
        expect(states).toHaveLength(1);
        const x = states[0].conversion;
        // closed form, Levenspiel ch. 5 (common practice): k tau = X (1 + eps X)/(1 - X)
        expect(rel((x * (1 + eps * x)) / (1 - x), k * tau)).toBeLessThan(1e-9);
      });
    }
  }

  it("a stage hotter than the feed dilutes the gas by T/T0 (no activation energy)", () => {
    const net = resolveNetwork(gas(0));
    const T = 2 * net.T0;
    const tau = 4;
    const x = streamMeasures(net, pfrOutletByResidenceTime(net, net.F0, T, tau).flows, T).conversion;
    // ideal gas: C_A = (F_A/F_T)(P/(R T)), so at twice the feed temperature the first-order rate per
    // volume halves: the closed form above holds with k T0/T in place of k (common practice)
    expect(rel(2 * Math.log(1 / (1 - x)) - x, (k * tau) / 2)).toBeLessThan(1e-8);
  });
});
