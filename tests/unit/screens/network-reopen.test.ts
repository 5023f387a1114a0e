import { describe, expect, it } from "vitest";
import { formToNetworkSpec, networkSpecToForm } from "@/components/kinetics/network-form-state";
import { networkKineticsSpecSchema } from "@/lib/schemas/network-spec";
import { networkKineticsInSI } from "@/lib/units/network-kinetics-si";

// Chemistry stored with quantities as text with units (as the command line and the demo write it).
const stored = networkKineticsSpecSchema.parse({
  feed: { volumetricFlow: "3.6 m^3/h", concentrations: { A: "1.2 mol/L", B: 0, C: 0, D: 0 }, temperature: "57 degC" },
  phase: "liquid",
  reactions: [
    { stoichiometry: { A: -1, B: 1 }, rate: { law: "power", k: "0.004 1/s", orders: { A: 1 } } },
    { stoichiometry: { B: -1, C: 1 }, rate: { law: "power", k: "0.048 1/min", orders: { B: 1 } } },
    { stoichiometry: { A: -2, D: 1 }, rate: { law: "power", k: "0.002 L/(mol*s)", orders: { A: 2 }, activationEnergy: "50 kJ/mol" } },
  ],
  keyReactant: "A",
  product: "B",
});

describe("a stored model of several reactions reopens in the editor", () => {
  it("converts text quantities to SI (exact unit definitions) and keeps their units as the ones shown", () => {
    const si = networkKineticsInSI(stored);
    expect(si.feed.volumetricFlow).toBeCloseTo(0.001, 15); // 3.6 m³/h
    expect(si.feed.concentrations.A).toBeCloseTo(1200, 9);
    expect(si.feed.temperature).toBeCloseTo(330.15, 9);
    expect(si.reactions[1]!.rate).toMatchObject({ k: expect.closeTo(0.0008, 15) }); // 0.048 per minute
    expect((si.reactions[2]!.rate as { k: number }).k).toBeCloseTo(2e-6, 18); // 0.002 L/(mol s) = 2e-6 m³/(mol s)
    expect(si.shownUnits).toMatchObject({
      "feed.volumetricFlow": "m3/h",
      "feed.concentrations.A": "mol/L",
      "feed.temperature": "degC",
      "reactions.1.rate.k": "mol/L|min",
      "reactions.2.rate.k": "mol/L|s",
      "reactions.2.rate.activationEnergy": "kJ/mol",
    });
  });

  it("the form shows the numbers as they were written, and saves the same chemistry in SI", () => {
    const v = networkSpecToForm(networkKineticsInSI(stored));
    expect(v.feed.volumetricFlow).toEqual({ value: "3.6", unit: "m3/h" });
    expect(v.feed.temperature).toEqual({ value: "57", unit: "degC" });
    expect(v.species.map((s) => [s.name, s.conc.value])).toEqual([["A", "1.2"], ["B", "0"], ["C", "0"], ["D", "0"]]);
    expect(v.reactions[1]!.k).toEqual({ value: "0.048", conc: "mol/L", time: "min" });
    expect(v.reactions[2]!.k).toEqual({ value: "0.002", conc: "mol/L", time: "s" });
    expect(v.reactions[2]!.activationEnergy).toEqual({ value: "50", unit: "kJ/mol" });
    const { spec, issues } = formToNetworkSpec(v);
    expect(issues).toEqual([]);
    // The same chemistry; the units shown gain those of the plain numbers (0 for B, C, D, in the form's mol/L).
    const si = networkKineticsInSI(stored);
    expect(spec).toEqual({ ...si, shownUnits: { ...si.shownUnits, "feed.concentrations.B": "mol/L", "feed.concentrations.C": "mol/L", "feed.concentrations.D": "mol/L" } });
  });
});
