import { describe, expect, it } from "vitest";
import { designNetwork } from "../../../../lib/engine/network/design";
import type { NetworkDesignSpec } from "../../../../lib/engine/network/design-types";
import { CA0, V0 } from "./design-helpers";
import { rel } from "./helpers";

const R = 8.314462618;
const T0 = 300;

/** A -> B -> C, first order, each with its own activation energy (J/mol), stage temperatures 300..360 K. */
function series(E1: number, E2: number): NetworkDesignSpec {
  return {
    feed: { volumetricFlow: V0, concentrations: { A: CA0, B: 0, C: 0 }, temperature: T0 },
    phase: "liquid",
    reactions: [
      { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: 0.05, orders: { A: 1 }, activationEnergy: E1 } },
      { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: 0.1, orders: { B: 1 }, activationEnergy: E2 } },
    ],
    keyReactant: "A",
    thermal: { mode: "stageTemperature", min: 300, max: 360 },
    train: { maxStages: 1 },
    objective: { maximise: "yield", product: "B" },
  };
}

const k = (k0: number, E: number, T: number) => k0 * Math.exp((-E / R) * (1 / T - 1 / T0));

describe("network designer with stage temperatures", { timeout: 120000 }, () => {
  // Levenspiel, ch. 8 closed forms for A -> B -> C: the best yields grow with k1/k2, so the best temperature is
  // the highest when the first step has the larger activation energy, the lowest otherwise (common practice).
  it.each([
    { E1: 80e3, E2: 40e3, T: 360 },
    { E1: 40e3, E2: 80e3, T: 300 },
  ])("single tube and tank at the temperature bound that favours the first step (E1 $E1, E2 $E2)", ({ E1, E2, T }) => {
    const r = designNetwork(series(E1, E2));
    const [k1, k2] = [k(0.05, E1, T), k(0.1, E2, T)];
    const tube = (k1 / k2) ** (k2 / (k2 - k1));
    const tank = 1 / (Math.sqrt(k2 / k1) + 1) ** 2;
    expect(rel(r.reference.singlePFR!.objective, tube)).toBeLessThan(1e-7);
    expect(rel(r.reference.singleCSTR!.objective, tank)).toBeLessThan(1e-7);
    expect(Math.abs(r.reference.singlePFR!.temperature! - T)).toBeLessThan(1e-3);
    expect(r.candidates[0].sequence).toEqual(["PFR"]);
    expect(r.candidates[0].stages[0].temperature).toBeCloseTo(T, 3);
  });
});
