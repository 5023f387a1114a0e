import { Solver } from "odex";
import { describe, expect, it } from "vitest";
import { designTrains, GAS_CONSTANT, type DesignSpec } from "../../../lib/engine/index";

// The adiabatic PFR as an initial-value problem in volume, dX/dV = (-rA)/FA0 with T = T0 + rise X,
// integrated by Hairer's ODEX extrapolation solver (the odex package): an independent reference for the
// engine's quadrature of V = FA0 * integral dX/(-rA).
function odeConversion(volume: number, p: { fa0: number; ca0: number; t0: number; k: number; ea: number; rise: number; kr?: number; ear?: number }) {
  const rate = (x: number) => {
    const t = p.t0 + p.rise * x;
    const f = p.k * Math.exp((-p.ea / GAS_CONSTANT) * (1 / t - 1 / p.t0)) * p.ca0 * (1 - x);
    const r = p.kr ? p.kr * Math.exp((-(p.ear ?? 0) / GAS_CONSTANT) * (1 / t - 1 / p.t0)) * p.ca0 * x : 0;
    return f - r;
  };
  const solver = new Solver(1);
  solver.absoluteTolerance = 1e-13;
  solver.relativeTolerance = 1e-13;
  solver.maxSteps = 100000;
  const out = solver.solve((_v: number, y: number[]) => [rate(y[0]) / p.fa0], 0, [0], volume);
  return out.y[0];
}

describe("adiabatic PFR against ODE integration (odex)", () => {
  const cases = [
    { fa0: 0.4, ca0: 900, t0: 320, k: 2e-4, ea: 70000, rise: 60, x: 0.9 },
    { fa0: 1.5, ca0: 2000, t0: 300, k: 5e-5, ea: 90000, rise: 120, x: 0.95 },
    { fa0: 0.2, ca0: 500, t0: 350, k: 1e-3, ea: 40000, rise: -30, x: 0.7 },
    { fa0: 0.5, ca0: 1200, t0: 330, k: 0.004, ea: 60000, rise: 100, x: 0.6, kr: 4e-5, ear: 120000 },
  ];
  for (const c of cases) {
    it(`rise ${c.rise} K, Ea ${c.ea}, X ${c.x}${c.kr ? ", reversible" : ""}`, () => {
      const spec: DesignSpec = {
        feed: { flowA: c.fa0, concA: c.ca0, temperature: c.t0, ratios: { R: 0 } },
        reaction: {
          stoichiometry: { A: -1, R: 1 },
          rate: {
            law: "power", k: c.k, orders: { A: 1 }, activationEnergy: c.ea,
            ...(c.kr ? { reverse: { k: c.kr, orders: { R: 1 }, activationEnergy: c.ear } } : {}),
          },
          thermal: { mode: "adiabatic", adiabaticRise: c.rise },
        },
        target: { conversion: c.x },
        train: { candidates: [["PFR"]] },
      };
      const v = designTrains(spec).reference.singlePFR as number;
      expect(Math.abs(odeConversion(v, c) - c.x)).toBeLessThan(1e-9);
    });
  }
});
