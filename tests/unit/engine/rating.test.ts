import { describe, expect, it } from "vitest";
import { GAS_CONSTANT, rateTrain } from "../../../lib/engine/index";

describe("rating", () => {
  it("first-order CSTR rating: X = k tau/(1 + k tau)", () => {
    const r = rateTrain({
      feed: { flowA: 0.5, concA: 1000 },
      reaction: { rate: { law: "power", k: 0.01, orders: { A: 1 } } },
      stages: [{ type: "CSTR", volume: "150 L" }, { type: "PFR", volume: 0.1 }],
    });
    const tau = 0.15 / (0.5 / 1000);
    // closed form, Levenspiel, ch. 5: CSTR X = k tau/(1 + k tau); PFR from X1: 1 - X = (1 - X1) exp(-k tau)
    const x1 = (0.01 * tau) / (1 + 0.01 * tau);
    expect(Math.abs(r.stages[0].conversionOut - x1)).toBeLessThan(1e-12);
    const x2 = 1 - (1 - x1) * Math.exp((-0.01 * 0.1) / (0.5 / 1000));
    expect(Math.abs(r.conversionOut - x2)).toBeLessThan(1e-10);
    expect(r.stages[0].multiple).toBe(false);
  });

  it("adiabatic CSTR with three steady states reports all three", () => {
    const r = rateTrain({
      feed: { flowA: 1, concA: 1000, temperature: 300 },
      reaction: {
        rate: { law: "power", k: 1e-4, orders: { A: 1 }, activationEnergy: 100000 },
        thermal: { mode: "adiabatic", adiabaticRise: 200 },
      },
      stages: [{ type: "CSTR", volume: "50 L" }],
    });
    const s = r.stages[0];
    expect(s.multiple).toBe(true);
    expect(s.steadyStates).toHaveLength(3);
    // Each state satisfies the mass and energy balances, FA0 X = V k(T) CA0 (1 - X), T = T0 + rise X
    // (common practice: the adiabatic CSTR balance, e.g. Fogler, Elements of Chemical Reaction Engineering, ch. 12).
    for (const st of s.steadyStates) {
      const t = 300 + 200 * st.conversionOut;
      const kT = 1e-4 * Math.exp((-100000 / GAS_CONSTANT) * (1 / t - 1 / 300));
      expect(Math.abs(st.conversionOut - (0.05 * kT * 1000 * (1 - st.conversionOut)) / 1)).toBeLessThan(1e-9);
    }
  });
});
