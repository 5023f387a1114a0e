import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { cstrSteadyStates } from "../../../../lib/engine/network/cstr";
import { pfrOutlet } from "../../../../lib/engine/network/pfr";
import { resolveNetwork, type ResolvedNetwork } from "../../../../lib/engine/network/resolve";
import { firstOrder, liquid } from "./helpers";

// Rate constants over six decades and residence times over four, drawn on a log scale.
const decades = (lo: number, hi: number) => fc.double({ min: Math.log10(lo), max: Math.log10(hi), noNaN: true }).map((e) => 10 ** e);
const rateConstant = decades(1e-3, 1e3);
const residenceTime = decades(1e-2, 1e2);

/** Conserved combination sum_i w_i F_i; w is orthogonal to every reaction's stoichiometry. */
function conserved(w: number[], F: ArrayLike<number>): number {
  return w.reduce((s, wi, i) => s + wi * F[i], 0);
}

function stages(net: ResolvedNetwork, tau: number) {
  const V = tau * net.v0;
  const tube = pfrOutlet(net, net.F0, net.T0, V).flows;
  const tanks = cstrSteadyStates(net, net.F0, net.T0, V).map((s) => s.flows);
  return [tube, ...tanks];
}

describe("mass balance closes for every stage (fast-check)", () => {
  it("A -> B -> C: F_A + F_B + F_C is constant (one mole of each per mole of A, common practice)", () => {
    fc.assert(
      fc.property(rateConstant, rateConstant, residenceTime, (k1, k2, tau) => {
        const net = resolveNetwork(liquid({ A: 500, B: 20, C: 0 }, [firstOrder("A", "B", k1), firstOrder("B", "C", k2)]));
        const total = conserved([1, 1, 1], net.F0);
        for (const F of stages(net, tau)) {
          expect(Math.abs(conserved([1, 1, 1], F) - total)).toBeLessThan(1e-9 * total);
          for (const f of F) expect(f).toBeGreaterThan(-1e-9 * total);
        }
      }),
      { numRuns: 40 },
    );
  });

  it("2A -> D (rate k C_A^2, gas or liquid): F_A + 2 F_D is constant (common practice)", () => {
    fc.assert(
      fc.property(rateConstant, residenceTime, fc.constantFrom("liquid" as const, "gas" as const), (k, tau, phase) => {
        const net = resolveNetwork({
          feed: { volumetricFlow: 1e-3, concentrations: { A: 40, D: 1, N: 10 } },
          phase,
          // k spans decades of 1/s; divided by C_A0 it is a second-order constant of the same speed
          reactions: [{ stoichiometry: { A: -2, D: 1 }, rate: { law: "power", k: k / 40, orders: { A: 2 } } }],
          keyReactant: "A",
        });
        const total = conserved([1, 2, 0], net.F0);
        for (const F of stages(net, tau)) {
          expect(Math.abs(conserved([1, 2, 0], F) - total)).toBeLessThan(1e-9 * total);
          expect(F[2]).toBe(net.F0[2]);
        }
      }),
      { numRuns: 40 },
    );
  });

  it("A + B <=> C with C -> D: F_A + F_C + F_D and F_B + F_C + F_D are constant (common practice)", () => {
    fc.assert(
      fc.property(rateConstant, rateConstant, rateConstant, residenceTime, (kf, kr, k2, tau) => {
        const net = resolveNetwork(
          liquid({ A: 30, B: 45, C: 0, D: 0 }, [
            { stoichiometry: { A: -1, B: -1, C: 1 }, rate: { law: "power", k: kf / 30, orders: { A: 1, B: 1 }, reverse: { k: kr, orders: { C: 1 } } } },
            firstOrder("C", "D", k2),
          ]),
        );
        const wA = [1, 0, 1, 1];
        const wB = [0, 1, 1, 1];
        for (const F of stages(net, tau)) {
          expect(Math.abs(conserved(wA, F) - conserved(wA, net.F0))).toBeLessThan(1e-9 * net.FT0);
          expect(Math.abs(conserved(wB, F) - conserved(wB, net.F0))).toBeLessThan(1e-9 * net.FT0);
        }
      }),
      { numRuns: 40 },
    );
  });
});
