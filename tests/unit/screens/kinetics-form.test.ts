import { describe, expect, it } from "vitest";
import { defaultKineticsValues, formPathOf, formToSpec, kineticsFormSchema, mapServerFields, specToForm } from "@/components/kinetics/kinetics-form-state";
import type { KineticsSpec } from "@/lib/schemas/sweeps";

describe("kinetics form → SI spec", () => {
  it("the default draft is first-order liquid kinetics in SI", () => {
    const { spec, issues } = formToSpec(defaultKineticsValues());
    expect(issues).toEqual([]);
    expect(spec).toEqual({
      feed: { flowA: 0.05, concA: 1500, temperature: 330 },
      reaction: { stoichiometry: { A: -1, R: 1 }, phase: "liquid", rate: { law: "power", k: 0.002, orders: { A: 1 } }, thermal: { mode: "isothermal" } },
      shownUnits: { "feed.flowA": "mol/s", "feed.concA": "mol/L", "feed.temperature": "K", "reaction.rate.k": "mol/L|s" },
    });
  });

  it("converts customary units to SI (exact definitions)", () => {
    const v = defaultKineticsValues();
    v.feed.flowA = { value: "7.2", unit: "kmol/h" };
    v.feed.temperature = { value: "80", unit: "degC" };
    v.reaction.rate.orders = [
      { name: "A", value: "1" },
      { name: "B", value: "1" },
    ];
    v.reaction.rate.k = { value: "6", conc: "mol/L", time: "min" };
    v.reaction.rate.arrheniusOn = true;
    v.reaction.rate.activationEnergy = { value: "50", unit: "kJ/mol" };
    v.reaction.thermal = { mode: "adiabatic", adiabaticRise: { value: "90", unit: "degF" }, maxTemperature: { value: "", unit: "K" }, interstageTemperature: { value: "330", unit: "K" } };
    const { spec } = formToSpec(v);
    expect(spec!.feed.flowA).toBeCloseTo(2, 12);
    expect(spec!.feed.temperature).toBeCloseTo(353.15, 12);
    const rate = spec!.reaction.rate as { k: number; activationEnergy: number };
    expect(rate.k).toBeCloseTo(1e-4, 15); // 6 L/(mol min) = 6e-3/60 m3/(mol s)
    expect(rate.activationEnergy).toBe(50000);
    expect(spec!.reaction.thermal).toEqual({ mode: "adiabatic", adiabaticRise: 50, interstageTemperature: 330 });
  });

  it("reports unreadable numbers and species at their fields", () => {
    const v = defaultKineticsValues();
    v.feed.concA.value = "abc";
    v.reaction.rate.orders = [{ name: "2x", value: "1" }];
    const { spec, issues } = formToSpec(v);
    expect(spec).toBeNull();
    expect(issues).toContainEqual({ path: "feed.concA.value", message: "Enter a number" });
    expect(issues.map((i) => i.path)).toContain("reaction.rate.orders.0.name");
  });

  it("every rate law maps to the engine's shape", () => {
    for (const law of ["saturation", "expression", "table"] as const) {
      const v = defaultKineticsValues();
      v.reaction.rate.law = law;
      const { spec, issues } = formToSpec(v);
      expect(issues).toEqual([]);
      expect(spec!.reaction.rate.law).toBe(law);
    }
    const v = defaultKineticsValues();
    v.reaction.rate.law = "saturation";
    const rate = formToSpec(v).spec!.reaction.rate as { vmax: number; km: number };
    expect(rate.vmax).toBeCloseTo(0.5 * 1000 / 60, 12); // 0.5 mol/(L min)
    expect(rate.km).toBeCloseTo(200, 12);
  });

  it("round-trips a reversible Arrhenius spec through the form", () => {
    const spec: KineticsSpec = {
      feed: { flowA: 0.02, concA: 1000, temperature: 340, ratios: { B: 1.2 } },
      reaction: {
        stoichiometry: { A: -1, B: -1, R: 1 },
        phase: "gas",
        epsilon: 0.5,
        rate: { law: "power", k: 1e-4, orders: { A: 1, B: 1 }, reverse: { k: 2e-5, orders: { R: 1 }, activationEnergy: 60000 }, activationEnergy: 45000 },
        thermal: { mode: "isothermal" },
      },
    };
    const back = formToSpec(specToForm(spec)).spec!;
    expect(back.feed).toEqual(spec.feed);
    expect(back.reaction.epsilon).toBe(0.5);
    const r = back.reaction.rate as { k: number; reverse: { k: number; activationEnergy: number }; activationEnergy: number };
    expect(r.k).toBeCloseTo(1e-4, 12);
    expect(r.reverse.k).toBeCloseTo(2e-5, 12);
    expect(r.reverse.activationEnergy).toBe(60000);
    expect(r.activationEnergy).toBe(45000);
  });

  it("maps engine and API error paths to form fields", () => {
    expect(formPathOf("spec.reaction.rate.k")).toBe("reaction.rate.k.value");
    expect(formPathOf("spec.reaction.rate.reverse.k")).toBe("reaction.rate.reverse.k.value");
    expect(formPathOf("spec.reaction.rate.orders.B")).toBe("reaction.rate.orders");
    expect(formPathOf("spec.reaction.rate.conversion.3")).toBe("reaction.rate.table");
    expect(formPathOf("targetConversion")).toBe("previewTarget");
    expect(mapServerFields({ "spec.feed.flowA": ["bad unit"], "(body)": ["Malformed JSON"] })).toEqual({ byField: { "feed.flowA.value": "bad unit" }, rest: ["Malformed JSON"] });
  });

  it("the form schema gives the API body and names a missing model name", () => {
    const ok = kineticsFormSchema("create").safeParse({ ...defaultKineticsValues(), name: "Bench fit" });
    expect(ok.success && ok.data.name).toBe("Bench fit");
    const bad = kineticsFormSchema("create").safeParse(defaultKineticsValues());
    expect(bad.success).toBe(false);
    expect(bad.error!.issues[0].path).toEqual(["name"]);
    expect(kineticsFormSchema("version").safeParse(defaultKineticsValues()).success).toBe(true);
  });
});
