import { describe, expect, it } from "vitest";
import { CAUTIONS, MODEL_ASSUMPTIONS, normaliseKinetics, thermalWarnings } from "@/lib/engine";

describe("the cautions", () => {
  it("name what the ideal models leave out and whom to defer to (common practice of the trade)", () => {
    const all = CAUTIONS.join(" ");
    for (const words of ["CSTR", "PFR", "steady state", "Heat removal", "runaway", "pressure relief", "local codes", "licensed engineer"]) expect(all).toContain(words);
    // The assumptions add to the cautions; they do not restate them in other words.
    for (const a of MODEL_ASSUMPTIONS) expect(CAUTIONS).not.toContain(a);
  });

  it("warn more strongly for an adiabatic rise of 50 K or more and for a stage within 10 K of its limit", () => {
    expect(thermalWarnings({ thermal: { mode: "isothermal" } })).toEqual([]);
    expect(thermalWarnings({ thermal: { mode: "adiabatic", adiabaticRise: 49.9 } })).toEqual([]);
    const [rise] = thermalWarnings({ thermal: { mode: "adiabatic", adiabaticRise: -60.4 } });
    expect(rise).toMatch(/^Adiabatic rise of 60 K/);
    expect(thermalWarnings({ thermal: { mode: "adiabatic", adiabaticRise: 20, maxTemperature: 400 }, stageTemperatures: [385, 390] })).toEqual([]);
    const [near] = thermalWarnings({ thermal: { mode: "adiabatic", adiabaticRise: 20, maxTemperature: 400 }, stageTemperatures: [385, 392.5] });
    expect(near).toContain("392.5 K, within 10 K of the 400.0 K limit");
  });
});

describe("the kinetics a screen reads back", () => {
  it("has every quantity in SI, by the engine's own reading of units", () => {
    // 1 mol/L = 1000 mol/m³ and T[K] = T[°C] + 273.15, exact by definition (SI brochure, common practice);
    // 5 kmol/h = 5000/3600 mol/s; 60 kJ/mol = 60000 J/mol.
    const si = normaliseKinetics({
      shownUnits: { concentration: "mol/L" },
      feed: { flowA: "5 kmol/h", concA: "1 mol/L" },
      reaction: { stoichiometry: { A: -1 }, rate: { law: "power", k: "0.06 1/min", orders: { A: 1 }, activationEnergy: "60 kJ/mol", referenceTemperature: "66.85 degC" } },
    } as unknown as Parameters<typeof normaliseKinetics>[0] & { shownUnits: Record<string, string> });
    expect(si.shownUnits).toEqual({ concentration: "mol/L" });
    expect(si.feed.flowA).toBeCloseTo(5000 / 3600, 12);
    expect(si.feed.concA).toBeCloseTo(1000, 9);
    expect(si.feed.temperature).toBe(298.15);
    const rate = si.reaction.rate as { k: number; activationEnergy: number; referenceTemperature: number };
    expect(rate.k).toBeCloseTo(0.001, 12);
    expect(rate.activationEnergy).toBeCloseTo(60000, 6);
    expect(rate.referenceTemperature).toBeCloseTo(340, 9);
  });
});
