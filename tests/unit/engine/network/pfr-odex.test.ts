import { Solver } from "odex";
import { describe, expect, it } from "vitest";
import { pfrOutlet } from "../../../../lib/engine/network/pfr";
import { resolveNetwork } from "../../../../lib/engine/network/resolve";
import type { NetworkSpec } from "../../../../lib/engine/network/types";

/**
 * A gas-phase network with no closed form — A + B <=> C (orders 1 and 0.5 forward, 1 reverse, Arrhenius
 * both ways), C -> 2D, and an inert N — integrated along the tube by Hairer's ODEX extrapolation code
 * (the odex package, an independent non-stiff integrator) from balances written out here from the
 * contract: dF_i/dV = sum_j nu_ij r_j with C_i = (F_i/F_T)(F_T0/v0)(T0/T).
 */
const R_GAS = 8.314462618; // J/(mol K), CODATA
const T0 = 420;
const v0 = 0.05;
const feed = { A: 30, B: 20, C: 0, D: 0, N: 15 };
const spec: NetworkSpec = {
  feed: { volumetricFlow: v0, concentrations: feed, temperature: T0 },
  phase: "gas",
  reactions: [
    {
      stoichiometry: { A: -1, B: -1, C: 1 },
      rate: { law: "power", k: 4e-3, orders: { A: 1, B: 0.5 }, activationEnergy: 50000, reverse: { k: 0.01, orders: { C: 1 }, activationEnergy: 80000 } },
    },
    { stoichiometry: { C: -1, D: 2 }, rate: { law: "power", k: 0.02, orders: { C: 1 }, activationEnergy: 20000, referenceTemperature: 400 } },
  ],
  keyReactant: "A",
};

function reference(T: number, V: number): number[] {
  const arr = (ea: number, tref: number) => Math.exp((-ea / R_GAS) * (1 / T - 1 / tref));
  const k1 = 4e-3 * arr(50000, T0);
  const k1r = 0.01 * arr(80000, T0);
  const k2 = 0.02 * arr(20000, 400);
  const F0 = Object.values(feed).map((c) => c * v0);
  const FT0 = F0.reduce((a, b) => a + b, 0);
  const solver = new Solver(5);
  solver.absoluteTolerance = 1e-14;
  solver.relativeTolerance = 1e-13;
  solver.maxSteps = 100000;
  const res = solver.solve(
    (_v: number, F: number[]) => {
      const FT = F.reduce((a, b) => a + b, 0);
      const C = F.map((f) => Math.max((f / FT) * (FT0 / v0) * (T0 / T), 0));
      const r1 = k1 * C[0] * Math.sqrt(C[1]) - k1r * C[2];
      const r2 = k2 * C[2];
      return [-r1, -r1, r1 - r2, 2 * r2, 0];
    },
    0,
    F0,
    V,
  );
  return res.y;
}

describe("tube against an independent integrator (odex)", () => {
  for (const [T, V] of [
    [420, 0.5],
    [450, 2],
    [380, 10],
  ]) {
    it(`gas network at ${T} K, ${V} m3`, () => {
      const net = resolveNetwork(spec);
      const ours = pfrOutlet(net, net.F0, T, V, { rtol: 1e-11 }).flows;
      const ref = reference(T, V);
      ref.forEach((f, i) => expect(Math.abs(ours[i] - f)).toBeLessThan(1e-8 * net.FT0));
      // the check is not empty: a good part of A reacted
      expect(ours[0]).toBeLessThan(0.9 * net.F0[0]);
    });
  }
});
